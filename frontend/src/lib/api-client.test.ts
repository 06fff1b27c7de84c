import { describe, expect, it, vi } from 'vitest';
import { ApiError, createApiClient } from './api-client';

interface Call {
  url: string;
  method: string;
  headers: Record<string, string>;
  body: string | undefined;
  credentials: RequestCredentials | undefined;
}

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

/** A fake server: `handler` answers each request; every request is recorded. */
function fakeServer(handler: (call: Call, index: number) => Response) {
  const calls: Call[] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const call: Call = {
      url: String(input),
      method: init?.method ?? 'GET',
      headers: { ...(init?.headers as Record<string, string> | undefined) },
      body: typeof init?.body === 'string' ? init.body : undefined,
      credentials: init?.credentials,
    };
    calls.push(call);
    return handler(call, calls.length - 1);
  });
  return { calls, client: createApiClient({ baseUrl: '/api/v1', fetch: fetchMock as typeof fetch }) };
}

describe('api client', () => {
  it('sends the session cookie and no CSRF token on GET', async () => {
    const { calls, client } = fakeServer(() => json(200, { status: 'ok' }));
    await expect(client.get('/health')).resolves.toEqual({ status: 'ok' });
    expect(calls).toHaveLength(1); // [practice] a safe request needs no token
    expect(calls[0]?.url).toBe('/api/v1/health');
    expect(calls[0]?.credentials).toBe('include');
    expect(calls[0]?.headers['X-CSRF-Token']).toBeUndefined();
  });

  it('fetches the CSRF token once and sends it as X-CSRF-Token on every unsafe request', async () => {
    const { calls, client } = fakeServer((call) =>
      call.url.endsWith('/auth/csrf') ? json(200, { csrfToken: 'token-one' }) : json(201, { id: 7 }),
    );
    await client.post('/api-tokens', { name: 'nightly' });
    await client.delete('/api-tokens/7');

    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual([
      'GET /api/v1/auth/csrf',
      'POST /api/v1/api-tokens',
      'DELETE /api/v1/api-tokens/7',
    ]);
    expect(calls[1]?.headers['X-CSRF-Token']).toBe('token-one');
    expect(calls[1]?.headers['Content-Type']).toBe('application/json');
    expect(calls[1]?.body).toBe('{"name":"nightly"}');
    expect(calls[2]?.headers['X-CSRF-Token']).toBe('token-one');
  });

  it('refetches the token and retries once when the server answers 403 csrf_invalid', async () => {
    let tokenVersion = 0;
    const { calls, client } = fakeServer((call) => {
      if (call.url.endsWith('/auth/csrf')) return json(200, { csrfToken: `token-${++tokenVersion}` });
      if (call.headers['X-CSRF-Token'] === 'token-1') {
        return json(403, { error: { code: 'csrf_invalid', message: 'CSRF token is invalid' } });
      }
      return json(200, { user: { id: 1 } });
    });

    await expect(client.patch('/users/1', { role: 'admin' })).resolves.toEqual({ user: { id: 1 } });
    expect(calls.map((c) => `${c.method} ${c.url} ${c.headers['X-CSRF-Token'] ?? '-'}`)).toEqual([
      'GET /api/v1/auth/csrf -',
      'PATCH /api/v1/users/1 token-1',
      'GET /api/v1/auth/csrf -',
      'PATCH /api/v1/users/1 token-2',
    ]);
  });

  it('retries only once: a second csrf_invalid is thrown as an ApiError', async () => {
    const { calls, client } = fakeServer((call) =>
      call.url.endsWith('/auth/csrf')
        ? json(200, { csrfToken: 'stale' })
        : json(403, { error: { code: 'csrf_invalid', message: 'CSRF token is invalid' } }),
    );
    const error = await client.post('/invitations', { email: 'a@b.org', role: 'viewer' }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect((error as ApiError).status).toBe(403);
    expect((error as ApiError).code).toBe('csrf_invalid');
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(2); // [practice] the original and one retry
  });

  it('does not retry a 403 with another code', async () => {
    const { calls, client } = fakeServer((call) =>
      call.url.endsWith('/auth/csrf')
        ? json(200, { csrfToken: 't' })
        : json(403, { error: { code: 'forbidden', message: 'Admins only' } }),
    );
    await expect(client.post('/invitations', {})).rejects.toMatchObject({ status: 403, code: 'forbidden' });
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(1); // [practice] only csrf_invalid is retried
  });

  it('throws a typed ApiError carrying the status, code, message and details of the error body', async () => {
    const { client } = fakeServer((call) =>
      call.url.endsWith('/auth/csrf')
        ? json(401, { error: { code: 'unauthorized', message: 'Sign in first' } })
        : json(409, { error: { code: 'last_admin', message: 'Keep one admin', details: { userId: 3 } } }),
    );
    const error = await client.patch('/users/3', { role: 'viewer' }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 409, code: 'last_admin', message: 'Keep one admin', details: { userId: 3 } });
  });

  it('sends an unsafe request without a token when there is no session to get one from', async () => {
    const { calls, client } = fakeServer((call) =>
      call.url.endsWith('/auth/csrf')
        ? json(401, { error: { code: 'unauthorized', message: 'No session' } })
        : json(200, { user: { id: 1 } }),
    );
    await client.post('/auth/login', { email: 'a@b.org', password: 'x' });
    expect(calls[1]?.headers['X-CSRF-Token']).toBeUndefined();
  });

  it('answers undefined for 204 and maps a body-less failure to a fallback code', async () => {
    const { client } = fakeServer((call, index) => {
      if (call.url.endsWith('/auth/csrf')) return json(200, { csrfToken: 't' });
      return index === 1 ? new Response(null, { status: 204 }) : new Response('', { status: 429 });
    });
    await expect(client.delete('/api-tokens/1')).resolves.toBeUndefined();
    await expect(client.post('/auth/login', {})).rejects.toMatchObject({ status: 429, code: 'rate_limited' });
  });

  it('reports an unreachable server as status 0 network_error', async () => {
    const client = createApiClient({
      baseUrl: '/api/v1',
      fetch: (() => Promise.reject(new TypeError('Failed to fetch'))) as typeof fetch,
    });
    await expect(client.get('/health')).rejects.toMatchObject({ status: 0, code: 'network_error' });
  });

  it('forgets the token on resetCsrfToken, so the next unsafe request fetches a new one', async () => {
    let n = 0;
    const { calls, client } = fakeServer((call) =>
      call.url.endsWith('/auth/csrf') ? json(200, { csrfToken: `t${++n}` }) : new Response(null, { status: 204 }),
    );
    await client.post('/auth/logout');
    client.resetCsrfToken();
    await client.post('/auth/logout');
    expect(calls.filter((c) => c.url.endsWith('/auth/csrf'))).toHaveLength(2); // [practice] one fetch per session
    expect(calls[3]?.headers['X-CSRF-Token']).toBe('t2');
  });
});
