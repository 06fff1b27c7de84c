import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderWithClient, stubApi } from '../../../test/render';
import { PollsterForm, aliasesOf } from './PollsterForm';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('aliasesOf', () => {
  it('takes one alias a line, trimmed, without blanks or repeats', () => {
    expect(aliasesOf(' Cobalt \n\nCobalt Res.\r\nCobalt \n')).toEqual(['Cobalt', 'Cobalt Res.']);
  });
});

describe('PollsterForm', () => {
  it('creates a firm with its aliases as a list', async () => {
    const requests = stubApi({ 'POST /pollsters': (body) => jsonResponse(201, { id: 9, ...(body as object) }) });
    renderWithClient(<PollsterForm />);
    fireEvent.change(screen.getByLabelText('Firm name'), { target: { value: 'Cobalt Research' } });
    fireEvent.change(screen.getByLabelText(/^Aliases/), { target: { value: 'Cobalt\nCobalt Res.' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create pollster' }));
    await waitFor(() => expect(requests).toHaveLength(1));
    expect(requests[0]?.body).toEqual({ name: 'Cobalt Research', aliases: ['Cobalt', 'Cobalt Res.'], notes: null });
  });

  it('needs a name', async () => {
    const requests = stubApi({});
    renderWithClient(<PollsterForm />);
    fireEvent.click(screen.getByRole('button', { name: 'Create pollster' }));
    expect(await screen.findByText('name is required')).toBeTruthy();
    expect(requests).toHaveLength(0);
  });
});
