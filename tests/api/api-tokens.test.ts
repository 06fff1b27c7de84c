import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => t.close());

describe('personal API tokens', () => {
  it('401 signed out', async () => {
    await request(t.app).post('/api/v1/api-tokens').send({ name: 'x' }).expect(401);
    await request(t.app).get('/api/v1/api-tokens').expect(401);
    await request(t.app).delete('/api/v1/api-tokens/1').expect(401);
  });

  it('400 without a name', async () => {
    const a = await t.signIn('viewer');
    const res = await a.post('/api/v1/api-tokens').send({ name: '  ' }).expect(400);
    expect(res.body.error.details[0]).toEqual({ field: 'name', message: 'name is required' });
  });

  it('shows the secret once, stores only its hash, authenticates as Bearer without CSRF, and stops after revoke', async () => {
    const a = await t.signIn('analyst');
    const created = await a.post('/api/v1/api-tokens').send({ name: 'nightly script' }).expect(201);
    const secret: string = created.body.token;
    expect(secret).toMatch(/^vc_/);
    const { ApiTokenModel } = await import('../../backend/src/db/models');
    const row = await ApiTokenModel.findByPk(created.body.id);
    expect(row?.tokenHash).toHaveLength(64);
    expect(row?.tokenHash).not.toContain(secret);
    const list = await a.get('/api/v1/api-tokens').expect(200);
    expect(JSON.stringify(list.body)).not.toContain(secret);
    const me = await request(t.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${secret}`).expect(200);
    expect(me.body.user.id).toBe(a.user.id);
    // Unsafe request with the token and no CSRF header works.
    await request(t.app).post('/api/v1/api-tokens').set('Authorization', `Bearer ${secret}`).send({ name: 'child' }).expect(201);
    await a.delete(`/api/v1/api-tokens/${created.body.id}`).expect(204);
    await request(t.app).get('/api/v1/auth/me').set('Authorization', `Bearer ${secret}`).expect(401);
  });

  it('another user cannot revoke my token (404), an admin can', async () => {
    const owner = await t.signIn('viewer');
    const id = (await owner.post('/api/v1/api-tokens').send({ name: 'mine' }).expect(201)).body.id;
    const other = await t.signIn('reviewer');
    await other.delete(`/api/v1/api-tokens/${id}`).expect(404);
    const admin = await t.signIn('admin');
    await admin.delete(`/api/v1/api-tokens/${id}`).expect(204);
  });

  it('a malformed Authorization header is 401', async () => {
    await request(t.app).get('/api/v1/auth/me').set('Authorization', 'Token abc').expect(401);
  });
});
