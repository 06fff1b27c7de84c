import type { Server } from 'node:http';
import { pino, type Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import { createMigrator } from '@veracast/database';
import type { Config } from './config';
import { createSequelize } from './db/sequelize';
import { initModels, UserModel } from './db/models';
import { createMailer } from './services/mail';
import { hashPassword, randomToken } from './services/crypto';
import { createApp } from './app';
import type { AppContext } from './http/context';
import { configureAuditWorkers, stopAuditWorkers, warmAuditWorkers } from './commands/audits/workers';

export function createLogger(config: Pick<Config, 'LOG_LEVEL'>): Logger {
  return pino({ level: config.LOG_LEVEL, base: undefined });
}

export async function migrate(sequelize: Sequelize, logger?: Logger) {
  const migrator = createMigrator(sequelize, logger ? { info: (m: unknown) => logger.debug(m) } : undefined);
  return migrator.up();
}

/**
 * Creates the first admin when there is none. Returns the generated password (to be printed once)
 * when ADMIN_PASSWORD was not set, else null.
 */
export async function ensureFirstAdmin(config: Pick<Config, 'ADMIN_EMAIL' | 'ADMIN_PASSWORD'>): Promise<{ email: string; generatedPassword: string | null } | null> {
  if ((await UserModel.count({ where: { role: 'admin' } })) > 0) return null;
  const generated = config.ADMIN_PASSWORD ? null : randomToken(15);
  const password = config.ADMIN_PASSWORD ?? generated!;
  const email = config.ADMIN_EMAIL.toLowerCase();
  const existing = await UserModel.findOne({ where: { email } });
  if (existing) await existing.update({ role: 'admin', passwordHash: await hashPassword(password), disabled: false });
  else await UserModel.create({ email, name: 'Administrator', role: 'admin', passwordHash: await hashPassword(password) });
  return { email, generatedPassword: generated };
}

export interface RunningServer {
  ctx: AppContext;
  server: Server;
  url: string;
  close(): Promise<void>;
}

/** Connects, migrates, starts mail and listens. Used by `npm start` and by the browser tests. */
export async function startServer(config: Config, hooks: { afterMigrate?: (ctx: AppContext) => Promise<void> } = {}): Promise<RunningServer> {
  const logger = createLogger(config);
  const sequelize = createSequelize(config);
  await sequelize.authenticate();
  await migrate(sequelize, logger);
  initModels(sequelize);
  const mailer = await createMailer({ smtpUrl: config.SMTP_URL, fakePort: config.SMTP_FAKE_PORT, from: config.MAIL_FROM, logger });
  const ctx: AppContext = { config, sequelize, mailer, logger };
  await hooks.afterMigrate?.(ctx);
  const app = createApp(ctx);
  // Audit worker threads start now (about half a second each), not on the first large audit.
  configureAuditWorkers(config.AUDIT_WORKERS);
  warmAuditWorkers();
  const server = await new Promise<Server>((resolve) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.PORT;
  return {
    ctx,
    server,
    url: `http://${config.HOST}:${port}`,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await mailer.close();
      await stopAuditWorkers();
      await sequelize.close();
    },
  };
}
