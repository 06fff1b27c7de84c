import { randomBytes } from 'node:crypto';
import request from 'supertest';
import type { Express } from 'express';
import type { Role } from '@veracast/shared-types';
import { loadConfig, type Config } from '../../backend/src/config';
import { createSequelize } from '../../backend/src/db/sequelize';
import { initModels, UserModel } from '../../backend/src/db/models';
import { createLogger, migrate } from '../../backend/src/bootstrap';
import { createMailer } from '../../backend/src/services/mail';
import { createApp } from '../../backend/src/app';
import { hashPassword } from '../../backend/src/services/crypto';
import type { AppContext } from '../../backend/src/http/context';
import { testEnv } from './env';

/** Creates a fresh, uniquely named database on the real MariaDB and migrates it. */
export async function createTestDatabase(overrides: Record<string, string> = {}): Promise<{ config: Config; drop: () => Promise<void> }> {
  const base = loadConfig({ ...testEnv(), ...overrides });
  const name = `${base.DB_NAME}_test_${Date.now().toString(36)}_${randomBytes(3).toString('hex')}`;
  const admin = createSequelize(base);
  await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.close();
  const config: Config = { ...base, DB_NAME: name };
  return {
    config,
    async drop() {
      const s = createSequelize(base);
      await s.query(`DROP DATABASE IF EXISTS \`${name}\``);
      await s.close();
    },
  };
}

export interface TestApp {
  app: Express;
  ctx: AppContext;
  config: Config;
  close(): Promise<void>;
  /** Creates a user directly in the database. */
  createUser(role: Role, overrides?: Partial<{ email: string; name: string; password: string; disabled: boolean }>): Promise<{ user: UserModel; email: string; password: string }>;
  /** A supertest agent signed in as a new user of `role`, sending the CSRF header on unsafe calls. */
  signIn(role: Role): Promise<SignedInAgent>;
}

export interface SignedInAgent {
  user: UserModel;
  csrf: string;
  get(url: string): request.Test;
  post(url: string): request.Test;
  patch(url: string): request.Test;
  put(url: string): request.Test;
  delete(url: string): request.Test;
}

let counter = 0;
export const uniqueEmail = (role: string) => `${role}-${Date.now().toString(36)}-${++counter}@example.test`;

export async function createTestApp(overrides: Record<string, string> = {}): Promise<TestApp> {
  const { config, drop } = await createTestDatabase(overrides);
  const logger = createLogger(config);
  const sequelize = createSequelize(config);
  await migrate(sequelize);
  initModels(sequelize);
  const mailer = await createMailer({ fakePort: 0, from: config.MAIL_FROM, logger, smtpUrl: undefined });
  const ctx: AppContext = { config, sequelize, mailer, logger };
  const app = createApp(ctx);

  async function createUser(role: Role, o: Partial<{ email: string; name: string; password: string; disabled: boolean }> = {}) {
    const email = o.email ?? uniqueEmail(role);
    const password = o.password ?? `pw-${role}-correct-horse`;
    const user = await UserModel.create({ email, name: o.name ?? `Test ${role}`, role, passwordHash: await hashPassword(password), disabled: o.disabled ?? false });
    return { user, email, password };
  }

  async function signIn(role: Role): Promise<SignedInAgent> {
    const { user, email, password } = await createUser(role);
    const agent = request.agent(app);
    await agent.post('/api/v1/auth/login').send({ email, password }).expect(200);
    const csrf = (await agent.get('/api/v1/auth/csrf').expect(200)).body.csrfToken as string;
    return {
      user,
      csrf,
      get: (url) => agent.get(url),
      post: (url) => agent.post(url).set('X-CSRF-Token', csrf),
      patch: (url) => agent.patch(url).set('X-CSRF-Token', csrf),
      put: (url) => agent.put(url).set('X-CSRF-Token', csrf),
      delete: (url) => agent.delete(url).set('X-CSRF-Token', csrf),
    };
  }

  return {
    app,
    ctx,
    config,
    createUser,
    signIn,
    async close() {
      await mailer.close();
      await sequelize.close();
      await drop();
    },
  };
}

/** Waits until the local mailbox holds a message to `to` (SMTP delivery is asynchronous). */
export async function waitForMail(to: string, timeoutMs = 5000) {
  const { MailMessageModel } = await import('../../backend/src/db/models');
  const { Op } = await import('sequelize');
  const start = Date.now();
  for (;;) {
    const m = await MailMessageModel.findOne({ where: { toAddress: { [Op.like]: `%${to}%` } }, order: [['id', 'DESC']] });
    if (m) return m;
    if (Date.now() - start > timeoutMs) throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 50));
  }
}
