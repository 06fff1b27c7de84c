import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import type { User } from '@veracast/shared-types';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, stubApi } from '../test/render';
import { AppProviders } from './providers';
import { createAppQueryClient } from './query-client';
import { createAppRoutes } from './router';

const TOKEN = 'invitation-token-0123456789abcdef';
const NEW_PASSWORD = 'a long enough passphrase';

function renderApp(path: string) {
  const queryClient = createAppQueryClient();
  queryClient.setDefaultOptions({ queries: { retry: false } });
  const router = createMemoryRouter(createAppRoutes(queryClient), { initialEntries: [path] });
  render(
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>,
  );
  return router;
}

const signedOut = () => jsonResponse(401, { error: { code: 'unauthorized', message: 'Sign in' } });

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('invitation page', () => {
  it('shows the e-mail and role, checks the repeated password, and sends the new account to sign-in', async () => {
    const created: User = {
      id: 9,
      email: 'new.analyst@example.org',
      name: 'New Analyst',
      role: 'analyst',
      disabled: false,
      createdAt: '2026-03-01T00:00:00.000Z',
    };
    const requests = stubApi({
      [`GET /invitations/${TOKEN}`]: () =>
        jsonResponse(200, { email: created.email, role: 'analyst', expiresAt: '2030-01-01T00:00:00.000Z' }),
      'POST /invitations/accept': () => jsonResponse(201, { user: created }),
      'GET /auth/me': signedOut,
    });
    const router = renderApp(`/invite/${TOKEN}`);

    expect(await screen.findByText(created.email)).toBeTruthy();
    expect(screen.getByText('Analyst')).toBeTruthy();

    fireEvent.change(screen.getByLabelText('Your name'), { target: { value: 'New Analyst' } });
    fireEvent.change(screen.getByLabelText(/^Password$/), { target: { value: NEW_PASSWORD } });
    fireEvent.change(screen.getByLabelText('Password again'), { target: { value: `${NEW_PASSWORD}!` } });
    fireEvent.click(screen.getByRole('button', { name: 'Create account' }));
    expect(await screen.findByText('The two passwords are not the same')).toBeTruthy();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);

    fireEvent.change(screen.getByLabelText('Password again'), { target: { value: NEW_PASSWORD } });
    fireEvent.click(screen.getByRole('button', { name: 'Create account' }));

    expect(await screen.findByText(/Your account is ready/)).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      token: TOKEN,
      name: 'New Analyst',
      password: NEW_PASSWORD,
    });
  });

  it('says plainly when an invitation has been used or has expired', async () => {
    stubApi({
      [`GET /invitations/${TOKEN}`]: () => jsonResponse(410, { error: { code: 'gone', message: 'Invitation used' } }),
    });
    renderApp(`/invite/${TOKEN}`);
    expect(await screen.findByText('This invitation cannot be used')).toBeTruthy();
    expect(screen.queryByLabelText('Your name')).toBeNull();
  });
});

describe('error boundary', () => {
  it('shows a plain message and recovers when "Try again" succeeds', async () => {
    let healthy = false;
    stubApi({
      'GET /auth/me': () =>
        healthy
          ? jsonResponse(200, {
              user: { id: 1, email: 'v@example.org', name: 'Vi', role: 'viewer', disabled: false, createdAt: '2026-01-01' },
            })
          : jsonResponse(500, { error: { code: 'internal', message: 'Internal error' } }),
      'GET /health': () => jsonResponse(200, { status: 'ok', database: 'up', version: '0.1.0' }),
    });
    const consoleError = vi.spyOn(console, 'error').mockImplementation(() => {});
    renderApp('/');

    expect(await screen.findByRole('heading', { name: 'Something went wrong' })).toBeTruthy();
    expect(screen.queryByText('Internal error')).toBeNull();

    healthy = true;
    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(await screen.findByRole('heading', { name: 'Overview' })).toBeTruthy();
    consoleError.mockRestore();
  });
});
