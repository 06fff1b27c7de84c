import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, waitForMail, type SignedInAgent, type TestApp } from '../helpers/test-app';

let t: TestApp;
let admin: SignedInAgent;
beforeAll(async () => {
  t = await createTestApp();
  admin = await t.signIn('admin');
});
afterAll(async () => t.close());

const adminRoutes: Array<[method: 'get' | 'post' | 'patch', url: string, body?: object]> = [
  ['get', '/api/v1/users'],
  ['patch', '/api/v1/users/1', { role: 'viewer' }],
  ['get', '/api/v1/invitations'],
  ['post', '/api/v1/invitations', { email: 'x@example.test', role: 'viewer' }],
  ['get', '/api/v1/admin/mailbox'],
  ['get', '/api/v1/admin/mailbox/1'],
];

describe('admin routes refuse everyone else', () => {
  it.each(adminRoutes)('%s %s: 401 signed out', async (method, url, body) => {
    const res = await request(t.app)[method](url).send(body ?? {});
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthorized');
  });
  for (const role of ['viewer', 'analyst', 'reviewer'] as const) {
    it.each(adminRoutes)(`%s %s: 403 for ${role}`, async (method, url, body) => {
      const a = await t.signIn(role);
      const res = await a[method](url).send(body ?? {});
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/needs the admin role/);
    });
  }
});

describe('invitations', () => {
  it('validates the invitation fields', async () => {
    const res = await admin.post('/api/v1/invitations').send({ email: 'nope', role: 'boss' }).expect(400);
    const fields = res.body.error.details.map((d: { field: string }) => d.field);
    expect(fields).toEqual(expect.arrayContaining(['email', 'role']));
  });

  it('mails a one-time link; accepting it creates the user with the invited role', async () => {
    const email = `invitee-${Date.now()}@example.test`;
    const created = await admin.post('/api/v1/invitations').send({ email, role: 'viewer' }).expect(201);
    expect(created.body.email).toBe(email);
    const mail = await waitForMail(email);
    expect(mail.subject).toMatch(/invited/);
    const token = /invite\/([A-Za-z0-9_-]+)/.exec(mail.textBody)?.[1] ?? '';
    const preview = await request(t.app).get(`/api/v1/invitations/${token}`).expect(200);
    expect(preview.body).toMatchObject({ email, role: 'viewer' });
    const bad = await request(t.app).post('/api/v1/invitations/accept').send({ token, name: '', password: 'short' }).expect(400);
    expect(bad.body.error.details.map((d: { field: string }) => d.field)).toEqual(expect.arrayContaining(['name', 'password']));
    const ok = await request(t.app).post('/api/v1/invitations/accept').send({ token, name: 'New Viewer', password: 'viewer-password-123' }).expect(201);
    expect(ok.body.user).toMatchObject({ email, role: 'viewer', name: 'New Viewer' });
    await request(t.app).post('/api/v1/invitations/accept').send({ token, name: 'Again', password: 'viewer-password-123' }).expect(410);
    await request(t.app).get(`/api/v1/invitations/${token}`).expect(410);
    await request(t.app).post('/api/v1/auth/login').send({ email, password: 'viewer-password-123' }).expect(200);
  });

  it('an expired invitation is refused', async () => {
    const email = `late-${Date.now()}@example.test`;
    await admin.post('/api/v1/invitations').send({ email, role: 'analyst' }).expect(201);
    const { InvitationModel } = await import('../../backend/src/db/models');
    await InvitationModel.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email } });
    const token = /invite\/([A-Za-z0-9_-]+)/.exec((await waitForMail(email)).textBody)?.[1] ?? '';
    const res = await request(t.app).post('/api/v1/invitations/accept').send({ token, name: 'Late', password: 'late-password-123' }).expect(410);
    expect(res.body.error.message).toMatch(/expired/);
  });

  it('an unknown token is 404', async () => {
    await request(t.app).get('/api/v1/invitations/aaaaaaaaaaaaaaaaaaaaaaaaaaaaaa').expect(404);
  });
});

describe('users', () => {
  it('lists users, changes a role, disables and re-enables', async () => {
    const { user } = await t.createUser('viewer');
    const list = await admin.get('/api/v1/users').expect(200);
    expect(list.body.items.some((u: { id: number }) => u.id === user.id)).toBe(true);
    expect(JSON.stringify(list.body)).not.toMatch(/password/i);
    const r = await admin.patch(`/api/v1/users/${user.id}`).send({ role: 'analyst' }).expect(200);
    expect(r.body.user.role).toBe('analyst');
    expect((await admin.patch(`/api/v1/users/${user.id}`).send({ disabled: true }).expect(200)).body.user.disabled).toBe(true);
    expect((await admin.patch(`/api/v1/users/${user.id}`).send({ disabled: false }).expect(200)).body.user.disabled).toBe(false);
  });

  it('validates the update and 404s an unknown user', async () => {
    const bad = await admin.patch('/api/v1/users/1').send({ role: 'king' }).expect(400);
    expect(bad.body.error.details[0].field).toBe('role');
    await admin.patch('/api/v1/users/abc').send({ role: 'viewer' }).expect(400);
    await admin.patch('/api/v1/users/999999').send({ role: 'viewer' }).expect(404);
  });

  it('never removes the last active admin', async () => {
    // Disable every other admin first, so `admin` is the last one.
    const { UserModel } = await import('../../backend/src/db/models');
    const { Op } = await import('sequelize');
    await UserModel.update({ disabled: true }, { where: { role: 'admin', id: { [Op.ne]: admin.user.id } } });
    const demote = await admin.patch(`/api/v1/users/${admin.user.id}`).send({ role: 'viewer' }).expect(409);
    expect(demote.body.error.code).toBe('last_admin');
    await admin.patch(`/api/v1/users/${admin.user.id}`).send({ disabled: true }).expect(409);
    const second = await t.createUser('admin');
    await admin.patch(`/api/v1/users/${admin.user.id}`).send({ role: 'reviewer' }).expect(200);
    await second.user.reload();
    expect(second.user.role).toBe('admin');
  });
});

describe('local mailbox', () => {
  it('shows messages the fake SMTP server received', async () => {
    const a = await t.signIn('admin');
    const email = `mailbox-${Date.now()}@example.test`;
    await a.post('/api/v1/invitations').send({ email, role: 'viewer' }).expect(201);
    await waitForMail(email);
    const list = await a.get('/api/v1/admin/mailbox').expect(200);
    const item = list.body.items.find((m: { to: string }) => m.to.includes(email));
    expect(item.subject).toMatch(/invited/);
    const one = await a.get(`/api/v1/admin/mailbox/${item.id}`).expect(200);
    expect(one.body.text).toMatch(/\/invite\//);
    await a.get('/api/v1/admin/mailbox/99999999').expect(404);
  });
});
