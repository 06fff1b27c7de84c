import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import type { ReactNode } from 'react';
import { MemoryRouter } from 'react-router-dom';
import { vi } from 'vitest';

/** Renders a component with a fresh query client (no retries) inside a memory router. */
export function renderWithClient(ui: ReactNode) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  return render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter>{ui}</MemoryRouter>
    </QueryClientProvider>,
  );
}

export function jsonResponse(status: number, body?: unknown): Response {
  return body === undefined
    ? new Response(null, { status })
    : new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

export interface RecordedRequest {
  method: string;
  path: string;
  body: unknown;
}

/**
 * Replaces `fetch` with a fake API. `routes` maps "METHOD /path" (after /api/v1) to a response;
 * the CSRF endpoint always answers. Returns the requests made, CSRF fetches excluded.
 */
export function stubApi(routes: Record<string, (body: unknown) => Response>): RecordedRequest[] {
  const requests: RecordedRequest[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const path = String(input).replace(/^\/api\/v1/, '');
      const method = init?.method ?? 'GET';
      if (path === '/auth/csrf') return jsonResponse(200, { csrfToken: 'csrf-test' });
      const body = typeof init?.body === 'string' ? (JSON.parse(init.body) as unknown) : undefined;
      requests.push({ method, path, body });
      const handler = routes[`${method} ${path}`];
      return handler ? handler(body) : jsonResponse(404, { error: { code: 'not_found', message: 'Not found' } });
    }),
  );
  return requests;
}
