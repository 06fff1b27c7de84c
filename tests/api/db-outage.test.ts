/**
 * A real outage: a second, throw-away mariadbd (own data directory, own port) is started, the app
 * is pointed at it, the server process is killed, and started again on the same data.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import net from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import { loadConfig } from '../../backend/src/config';
import { createSequelize } from '../../backend/src/db/sequelize';
import { initModels } from '../../backend/src/db/models';
import { createLogger, migrate } from '../../backend/src/bootstrap';
import { createMailer, type Mailer } from '../../backend/src/services/mail';
import { createApp } from '../../backend/src/app';
import { testEnv } from '../helpers/env';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'veracast-outage-'));
const socket = path.join(dir, 'mysqld.sock');
let port = 0;
let server: ChildProcess | undefined;

const freePort = () =>
  new Promise<number>((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const p = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(p));
    });
  });

async function startMariadb() {
  server = spawn('mariadbd', ['--no-defaults', '--user=root', `--datadir=${dir}/data`, `--socket=${socket}`, `--pid-file=${dir}/pid`, `--port=${port}`, '--bind-address=127.0.0.1', '--skip-name-resolve', `--log-error=${dir}/error.log`, '--innodb-buffer-pool-size=32M'], { stdio: 'ignore' });
  for (let i = 0; i < 200; i++) {
    if (spawnSync('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-uroot', 'ping'], { stdio: 'ignore' }).status === 0) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('the throw-away mariadbd did not start');
}
async function stopMariadb() {
  const s = server;
  server = undefined;
  if (!s) return;
  const done = new Promise((r) => s.once('exit', r));
  s.kill('SIGKILL');
  await done;
}

let app: Express;
let mailer: Mailer;
let close: () => Promise<void>;

beforeAll(async () => {
  port = await freePort();
  const init = spawnSync('mariadb-install-db', ['--no-defaults', `--datadir=${dir}/data`, '--user=root', '--auth-root-authentication-method=normal', '--skip-test-db'], { encoding: 'utf8' });
  if (init.status !== 0) throw new Error(`mariadb-install-db failed: ${init.stderr}`);
  await startMariadb();
  const sql = "CREATE DATABASE vc; CREATE USER 'vc'@'127.0.0.1' IDENTIFIED BY 'vc-outage-pw'; GRANT ALL ON vc.* TO 'vc'@'127.0.0.1';";
  spawnSync('mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot', '-e', sql]);
  const config = { ...loadConfig(testEnv()), DB_PORT: port, DB_NAME: 'vc', DB_USER: 'vc', DB_PASSWORD: 'vc-outage-pw' };
  const logger = createLogger(config);
  const sequelize = createSequelize(config);
  await migrate(sequelize);
  initModels(sequelize);
  mailer = await createMailer({ fakePort: 0, from: config.MAIL_FROM, logger, smtpUrl: undefined });
  app = createApp({ config, sequelize, mailer, logger });
  close = async () => {
    await mailer.close();
    await sequelize.close().catch(() => undefined);
  };
}, 60_000);

afterAll(async () => {
  await close?.();
  await stopMariadb();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('MariaDB goes down and comes back', () => {
  it('answers 503 with a clear message while it is down, keeps running, and recovers', async () => {
    await request(app).get('/api/v1/health').expect(200);
    await stopMariadb();
    const health = await request(app).get('/api/v1/health').expect(503);
    expect(health.body).toMatchObject({ status: 'degraded', database: 'down' });
    const login = await request(app).post('/api/v1/auth/login').send({ email: 'a@b.test', password: 'whatever-long' }).expect(503);
    expect(login.body.error).toEqual({ code: 'database_unavailable', message: 'The database is not reachable right now; try again shortly' });
    await startMariadb();
    let status = 0;
    for (let i = 0; i < 50 && status !== 200; i++) {
      status = (await request(app).get('/api/v1/health')).status;
      if (status !== 200) await new Promise((r) => setTimeout(r, 200));
    }
    expect(status).toBe(200);
    await request(app).post('/api/v1/auth/login').send({ email: 'a@b.test', password: 'whatever-long' }).expect(401);
  }, 60_000);
});
