import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import type { User } from '@veracast/shared-types';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderWithClient, stubApi } from '../../../test/render';
import { UsersTable } from './UsersTable';

function buildUser(overrides: Partial<User> = {}): User {
  return {
    id: 1,
    email: 'only.admin@example.org',
    name: 'Only Admin',
    role: 'admin',
    disabled: false,
    createdAt: '2026-01-05T10:00:00.000Z',
    ...overrides,
  };
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('UsersTable', () => {
  it('sends a role change and explains a refusal that would remove the last admin', async () => {
    const admin = buildUser();
    const requests = stubApi({
      'GET /users': () => jsonResponse(200, { items: [admin], total: 1 }),
      'PATCH /users/1': () =>
        jsonResponse(409, { error: { code: 'last_admin', message: 'At least one admin must remain' } }),
    });
    renderWithClient(<UsersTable currentUserId={1} />);

    const select = (await screen.findByRole('combobox', { name: 'Role of only.admin@example.org' })) as HTMLSelectElement;
    expect(screen.getByText('(you)')).toBeTruthy();
    fireEvent.change(select, { target: { value: 'viewer' } });

    expect(await screen.findByText(/without an active administrator/)).toBeTruthy();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ role: 'viewer' });
    // The refused change is not shown as if it had been saved.
    await waitFor(() => expect(select.value).toBe('admin'));
  });

  it('toggles an account off with the disabled switch', async () => {
    const analyst = buildUser({ id: 2, email: 'kim@example.org', name: 'Kim', role: 'analyst' });
    const requests = stubApi({
      'GET /users': () => jsonResponse(200, { items: [analyst], total: 1 }),
      'PATCH /users/2': () => jsonResponse(200, { user: { ...analyst, disabled: true } }),
    });
    renderWithClient(<UsersTable />);

    const toggle = await screen.findByRole('switch', { name: 'Account of kim@example.org disabled' });
    expect(toggle.getAttribute('aria-checked')).toBe('false');
    fireEvent.click(toggle);
    expect(await screen.findByText(/account disabled/)).toBeTruthy();
    expect(requests.find((r) => r.method === 'PATCH')?.body).toEqual({ disabled: true });
  });
});
