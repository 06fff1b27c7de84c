import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, type TestApp } from '../helpers/test-app';
import { ConfigError, loadConfig } from '../../backend/src/config';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => t.close());

describe('server basics', () => {
  it('health reports the database up', async () => {
    const res = await request(t.app).get('/api/v1/health').expect(200);
    expect(res.body).toMatchObject({ status: 'ok', database: 'up' });
  });

  it('sets security headers', async () => {
    const res = await request(t.app).get('/api/v1/health');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('unknown API routes answer a JSON 404', async () => {
    const res = await request(t.app).get('/api/v1/nope').expect(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('malformed JSON answers 400', async () => {
    const res = await request(t.app).post('/api/v1/auth/login').set('Content-Type', 'application/json').send('{"email":').expect(400);
    expect(res.body.error.code).toBe('bad_json');
  });

  it('serves an OpenAPI document listing the routes', async () => {
    const res = await request(t.app).get('/api/v1/openapi.json').expect(200);
    expect(res.body.openapi).toBe('3.1.0');
    expect(Object.keys(res.body.paths)).toEqual(expect.arrayContaining(['/auth/login', '/api-tokens', '/users/{id}']));
  });

  it('configuration lists every bad variable at once', () => {
    let caught: unknown;
    try {
      loadConfig({ DB_PASSWORD: '', JWT_SECRET: 'short', PORT: 'eighty' });
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(ConfigError);
    const msg = (caught as Error).message;
    expect(msg).toMatch(/DB_PASSWORD/);
    expect(msg).toMatch(/JWT_SECRET: JWT_SECRET must be at least 32 characters/);
    expect(msg).toMatch(/PORT/);
  });
});
