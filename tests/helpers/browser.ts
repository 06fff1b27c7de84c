import { chromium, type Browser, type Page } from 'playwright-core';
import { loadConfig } from '../../backend/src/config';
import { ensureFirstAdmin, startServer, type RunningServer } from '../../backend/src/bootstrap';
import { loadDemo } from '../../backend/src/commands/load-demo';
import { UserModel } from '../../backend/src/db/models';
import { hashPassword } from '../../backend/src/services/crypto';
import type { Role } from '@veracast/shared-types';
import { createTestDatabase } from './test-app';
import { testEnv } from './env';

export const ADMIN = { email: 'admin@browser.test', password: 'browser-admin-password' };

export interface BrowserApp {
  server: RunningServer;
  browser: Browser;
  url: string;
  newPage(): Promise<Page>;
  /** Creates a user directly and signs a fresh page in as that user. */
  signedInPage(role: Role): Promise<{ page: Page; email: string; password: string }>;
  close(): Promise<void>;
}

/**
 * Serves the production build (frontend/dist, built by `npm test` before the tests run) from the
 * real Express app on 127.0.0.1 with a fresh database, optionally loaded with the demo scenario,
 * and launches Debian's chromium through playwright-core.
 */
export async function startBrowserApp(options: { demo?: boolean } = {}): Promise<BrowserApp> {
  const { config, drop } = await createTestDatabase();
  const server = await startServer(
    { ...loadConfig({ ...testEnv(), ADMIN_EMAIL: ADMIN.email, ADMIN_PASSWORD: ADMIN.password }), DB_NAME: config.DB_NAME, PORT: 0 },
    {
      async afterMigrate(ctx) {
        await ensureFirstAdmin({ ADMIN_EMAIL: ADMIN.email, ADMIN_PASSWORD: ADMIN.password });
        if (options.demo) {
          const admin = await UserModel.findOne({ where: { email: ADMIN.email } });
          await loadDemo(ctx.sequelize, admin?.id ?? null);
        }
      },
    },
  );
  // Links in e-mails must point at this server.
  server.ctx.config.publicUrl = server.url;
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  let n = 0;
  const newPage = async () => {
    const context = await browser.newContext({ baseURL: server.url, acceptDownloads: true });
    return context.newPage();
  };
  return {
    server,
    browser,
    url: server.url,
    newPage,
    async signedInPage(role) {
      const email = `${role}-${Date.now()}-${++n}@browser.test`;
      const password = `browser-${role}-password`;
      await UserModel.create({ email, name: `Browser ${role}`, role, passwordHash: await hashPassword(password) });
      const page = await newPage();
      await signIn(page, email, password);
      return { page, email, password };
    },
    async close() {
      await browser.close();
      await server.close();
      await drop();
    },
  };
}

export async function signIn(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail', { exact: false }).first().fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}
