import { cleanup, fireEvent, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderWithClient, stubApi } from '../../../test/render';
import { CreateApiTokenForm } from './CreateApiTokenForm';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('CreateApiTokenForm', () => {
  it('creates a token and shows its secret once, with a warning, until dismissed', async () => {
    const secret = 'vc_secret_made_up_for_this_test_0123456789';
    const requests = stubApi({
      'POST /api-tokens': () => jsonResponse(201, { id: 5, name: 'nightly import', token: secret }),
      'GET /api-tokens': () => jsonResponse(200, { items: [], total: 0 }),
    });
    renderWithClient(<CreateApiTokenForm />);

    fireEvent.change(screen.getByLabelText(/Token name/), { target: { value: '  nightly import ' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create token' }));

    const field = (await screen.findByLabelText('New token “nightly import”')) as HTMLInputElement;
    expect(field.value).toBe(secret);
    expect(field.readOnly).toBe(true);
    expect(screen.getByText('Copy this token now')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Copy token' })).toBeTruthy();
    // The name is trimmed by the shared schema before it is sent.
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({ name: 'nightly import' });

    fireEvent.click(screen.getByRole('button', { name: 'I have stored it' }));
    expect(await screen.findByRole('button', { name: 'Create token' })).toBeTruthy();
    expect(screen.queryByDisplayValue(secret)).toBeNull();
  });

  it('refuses an empty name without calling the API', async () => {
    const requests = stubApi({});
    renderWithClient(<CreateApiTokenForm />);
    fireEvent.click(screen.getByRole('button', { name: 'Create token' }));
    expect(await screen.findByText('name is required')).toBeTruthy();
    expect(requests).toHaveLength(0);
  });
});
