import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import type { Role, User } from '@veracast/shared-types';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppProviders } from './providers';
import { createAppQueryClient } from './query-client';
import { createAppRoutes } from './router';

function buildUser(overrides: Partial<User> = {}): User {
  return {
    id: 1,
    email: 'ada@example.org',
    name: 'Ada Example',
    role: 'viewer',
    disabled: false,
    createdAt: '2026-01-05T10:00:00.000Z',
    ...overrides,
  };
}

function json(status: number, body: unknown) {
  return new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
}

/** Stands in for the API: the signed-in user (or nobody) and empty lists. */
function stubApi(user: User | null) {
  const requests: string[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const url = String(input);
      const method = init?.method ?? 'GET';
      requests.push(`${method} ${url}`);
      if (url.endsWith('/auth/me')) {
        return user ? json(200, { user }) : json(401, { error: { code: 'unauthorized', message: 'Sign in' } });
      }
      if (url.endsWith('/auth/csrf')) return json(200, { csrfToken: 'csrf-test' });
      if (url.endsWith('/auth/logout')) return new Response(null, { status: 204 });
      if (url.endsWith('/health')) return json(200, { status: 'ok', database: 'up', version: '0.1.0' });
      if (url.endsWith('/users')) return json(200, { items: user ? [user] : [], total: user ? 1 : 0 });
      return json(200, { items: [], total: 0 });
    }),
  );
  return requests;
}

function renderAt(path: string, user: User | null) {
  const requests = stubApi(user);
  const queryClient = createAppQueryClient();
  const router = createMemoryRouter(createAppRoutes(queryClient), { initialEntries: [path] });
  render(
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>,
  );
  return { router, requests };
}

function signedIn(role: Role) {
  return buildUser({ role, name: `${role} person` });
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('role-aware routing', () => {
  it('hides the Admin navigation from a viewer', async () => {
    renderAt('/', signedIn('viewer'));
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    expect(within(nav).getByRole('link', { name: 'Elections' })).toBeTruthy();
    expect(within(nav).queryByRole('link', { name: 'Users & invitations' })).toBeNull();
    expect(within(nav).queryByRole('link', { name: 'Local mailbox' })).toBeNull();
    expect(within(nav).queryByRole('heading', { name: 'Admin' })).toBeNull();
    // Importing needs the analyst role (SPEC §2).
    expect(within(nav).queryByRole('link', { name: 'Imports' })).toBeNull();
  });

  it('shows the Admin navigation to an admin', async () => {
    renderAt('/', signedIn('admin'));
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    expect(within(nav).getByRole('link', { name: 'Users & invitations' })).toBeTruthy();
    expect(within(nav).getByRole('link', { name: 'Local mailbox' })).toBeTruthy();
    expect(within(nav).getByRole('link', { name: 'Imports' })).toBeTruthy();
  });

  it('shows a viewer who types /admin/users the 403 page, never the screen, and fetches no user list', async () => {
    const { requests } = renderAt('/admin/users', signedIn('viewer'));
    expect(await screen.findByRole('heading', { name: 'You do not have access' })).toBeTruthy();
    expect(screen.queryByRole('heading', { name: 'Users & invitations' })).toBeNull();
    expect(screen.queryByRole('table', { name: 'Users' })).toBeNull();
    expect(requests.some((r) => r.endsWith('/users'))).toBe(false);
  });

  it('shows an admin the users screen', async () => {
    renderAt('/admin/users', signedIn('admin'));
    expect(await screen.findByRole('heading', { name: 'Users & invitations', level: 1 })).toBeTruthy();
    expect(await screen.findByRole('table', { name: 'Users' })).toBeTruthy();
    expect(screen.getByRole('combobox', { name: 'Role of ada@example.org' })).toBeTruthy();
  });

  it('sends a signed-out visitor to sign-in, remembering where they were going', async () => {
    const { router } = renderAt('/admin/mailbox', null);
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(new URLSearchParams(router.state.location.search).get('next')).toBe('/admin/mailbox');
    expect(screen.getByLabelText('E-mail address')).toBeTruthy();
    expect(screen.getByLabelText('Password')).toBeTruthy();
  });

  it('answers an unknown address with the 404 page', async () => {
    renderAt('/no/such/page', signedIn('viewer'));
    expect(await screen.findByRole('heading', { name: 'Page not found' })).toBeTruthy();
  });

  it('signs out and lands on sign-in with a notice', async () => {
    const { router, requests } = renderAt('/', signedIn('analyst'));
    fireEvent.click(await screen.findByRole('button', { name: 'Sign out' }));
    expect(await screen.findByText('You have signed out.')).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(requests).toContain('POST /api/v1/auth/logout');
  });
});
