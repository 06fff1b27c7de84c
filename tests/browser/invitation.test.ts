import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ADMIN, signIn, startBrowserApp, type BrowserApp } from '../helpers/browser';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => app?.close());

describe('inviting a viewer through the browser', () => {
  it('admin invites, the invitee sets a password from the local mailbox, and the admin area stays closed to them', async () => {
    const email = `viewer-${Date.now()}@browser.test`;
    const admin = await app.newPage();
    await signIn(admin, ADMIN.email, ADMIN.password);
    await admin.getByRole('link', { name: 'Users & invitations' }).click();
    await admin.getByLabel('E-mail address to invite').fill(email);
    await admin.getByLabel('Role', { exact: true }).selectOption('viewer');
    await admin.getByRole('button', { name: /send invitation/i }).click();
    await admin.getByText(email).first().waitFor().catch(async (e) => { await admin.screenshot({ path: '/tmp/invite-fail.png', fullPage: true }); throw e; });

    await admin.getByRole('navigation').getByRole('link', { name: 'Local mailbox' }).click();
    await admin.getByRole('link', { name: /invited/i }).first().click();
    const link = admin.getByRole('link', { name: /\/invite\// });
    const href = await link.getAttribute('href');
    expect(href).toMatch(/\/invite\/[A-Za-z0-9_-]+$/);

    const invitee = await app.newPage();
    await invitee.goto(href!);
    await invitee.getByText(email).waitFor();
    await invitee.getByLabel('Your name').fill('Vera Viewer');
    await invitee.getByLabel('Password', { exact: true }).fill('viewer-browser-password');
    await invitee.getByLabel('Password again').fill('viewer-browser-password');
    await invitee.getByRole('button', { name: /create|accept|set/i }).click();
    await invitee.waitForURL((u) => u.pathname === '/' || u.pathname.startsWith('/sign-in'));
    if (new URL(invitee.url()).pathname.startsWith('/sign-in')) await signIn(invitee, email, 'viewer-browser-password');

    await invitee.getByRole('link', { name: 'Elections' }).waitFor();
    expect(await invitee.getByRole('link', { name: 'Users & invitations' }).count()).toBe(0);
    expect(await invitee.getByRole('link', { name: 'Local mailbox' }).count()).toBe(0);
    await invitee.goto('/admin/users');
    await invitee.getByText(/do not have access/i).waitFor();
    expect(await invitee.getByLabel('E-mail address to invite').count()).toBe(0);
    const api = await invitee.request.get('/api/v1/users');
    expect(api.status()).toBe(403);
  });
});
