import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => t.close());

describe('POST /api/v1/auth/login', () => {
  it('signs in with the right password, sets an httpOnly SameSite cookie and never returns the hash', async () => {
    const { email, password } = await t.createUser('analyst');
    const res = await request(t.app).post('/api/v1/auth/login').send({ email: email.toUpperCase(), password }).expect(200);
    expect(res.body.user.email).toBe(email);
    expect(res.body.user.role).toBe('analyst');
    expect(JSON.stringify(res.body)).not.toMatch(/argon2|passwordHash/);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/veracast_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Strict/i);
  });

  it('answers 401 with the same message for a wrong password and an unknown e-mail', async () => {
    const { email } = await t.createUser('viewer');
    const wrongPw = await request(t.app).post('/api/v1/auth/login').send({ email, password: 'not-the-password' }).expect(401);
    const unknown = await request(t.app).post('/api/v1/auth/login').send({ email: 'nobody@example.test', password: 'not-the-password' }).expect(401);
    expect(wrongPw.body.error.code).toBe('invalid_credentials');
    expect(unknown.body.error).toEqual(wrongPw.body.error);
  });

  it('refuses a disabled user', async () => {
    const { email, password } = await t.createUser('viewer', { disabled: true });
    await request(t.app).post('/api/v1/auth/login').send({ email, password }).expect(401);
  });

  it('answers 400 naming each invalid field', async () => {
    const res = await request(t.app).post('/api/v1/auth/login').send({ email: 'not-an-email', password: '' }).expect(400);
    const fields = res.body.error.details.map((d: { field: string }) => d.field);
    expect(fields).toEqual(expect.arrayContaining(['email', 'password']));
    expect(res.body.error.message).toMatch(/email: email must be a valid e-mail address/);
  });

  it('refuses the tenth quick wrong try with 429 while a right password before it still works', async () => {
    const { email } = await t.createUser('viewer');
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) {
      statuses.push((await request(t.app).post('/api/v1/auth/login').send({ email, password: `wrong-${i}` })).status);
    }
    expect(statuses.slice(0, 9).every((s) => s === 401)).toBe(true);
    expect(statuses[9]).toBe(429);
  });
});

describe('session, CSRF and sign-out', () => {
  it('GET /auth/me is 401 signed out and returns the user signed in', async () => {
    await request(t.app).get('/api/v1/auth/me').expect(401);
    const a = await t.signIn('reviewer');
    const me = await a.get('/api/v1/auth/me').expect(200);
    expect(me.body.user.role).toBe('reviewer');
  });

  it('rejects an unsafe cookie request without or with a wrong X-CSRF-Token', async () => {
    const { email, password } = await t.createUser('viewer');
    const agent = request.agent(t.app);
    await agent.post('/api/v1/auth/login').send({ email, password }).expect(200);
    const none = await agent.post('/api/v1/api-tokens').send({ name: 'x' }).expect(403);
    expect(none.body.error.code).toBe('csrf_invalid');
    await agent.post('/api/v1/api-tokens').set('X-CSRF-Token', 'forged').send({ name: 'x' }).expect(403);
    const { csrfToken } = (await agent.get('/api/v1/auth/csrf').expect(200)).body;
    await agent.post('/api/v1/api-tokens').set('X-CSRF-Token', csrfToken).send({ name: 'x' }).expect(201);
  });

  it('GET /auth/csrf is 401 signed out', async () => {
    await request(t.app).get('/api/v1/auth/csrf').expect(401);
  });

  it('logout clears the cookie', async () => {
    const a = await t.signIn('viewer');
    const res = await a.post('/api/v1/auth/logout').expect(204);
    expect(String(res.headers['set-cookie'])).toMatch(/veracast_session=;/);
  });

  it('a forged or expired JWT is ignored', async () => {
    await request(t.app).get('/api/v1/auth/me').set('Cookie', 'veracast_session=eyJhbGciOiJIUzI1NiJ9.eyJzdWIiOiIxIn0.bad').expect(401);
  });

  it('a disabled user loses access at once', async () => {
    const a = await t.signIn('analyst');
    await a.user.update({ disabled: true });
    await a.get('/api/v1/auth/me').expect(401);
  });
});

describe('password reset', () => {
  it('mails a one-time link that sets a new password once', async () => {
    const { email } = await t.createUser('viewer');
    await request(t.app).post('/api/v1/auth/password-reset/request').send({ email }).expect(202);
    const unknown = await request(t.app).post('/api/v1/auth/password-reset/request').send({ email: 'ghost@example.test' }).expect(202);
    expect(unknown.body.message).toMatch(/If the address/);
    const { waitForMail } = await import('../helpers/test-app');
    const mail = await waitForMail(email);
    const token = /reset-password\/([A-Za-z0-9_-]+)/.exec(mail.textBody)?.[1];
    expect(token).toBeTruthy();
    await request(t.app).post('/api/v1/auth/password-reset/confirm').send({ token, password: 'short' }).expect(400);
    await request(t.app).post('/api/v1/auth/password-reset/confirm').send({ token, password: 'a-brand-new-password' }).expect(204);
    await request(t.app).post('/api/v1/auth/login').send({ email, password: 'a-brand-new-password' }).expect(200);
    const again = await request(t.app).post('/api/v1/auth/password-reset/confirm').send({ token, password: 'another-new-password' }).expect(410);
    expect(again.body.error.message).toMatch(/already used or expired/);
  });
});
