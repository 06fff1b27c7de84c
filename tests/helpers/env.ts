import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** The environment the tests run with: the scripts' values, or the secrets kept under .data/. */
export function testEnv(): NodeJS.ProcessEnv {
  const fromFile = (name: string) => {
    const p = path.join(ROOT, '.data', name);
    return fs.existsSync(p) ? fs.readFileSync(p, 'utf8').trim() : undefined;
  };
  return {
    ...process.env,
    NODE_ENV: 'test',
    DB_PASSWORD: process.env.DB_PASSWORD || fromFile('db-password'),
    JWT_SECRET: process.env.JWT_SECRET || fromFile('jwt-secret') || 'test-secret-test-secret-test-secret-0123',
    LOG_LEVEL: process.env.TEST_LOG_LEVEL || 'silent',
    SMTP_URL: '',
    SMTP_FAKE_PORT: '0',
    PORT: '0',
    LOAD_DEMO: 'false',
  };
}
