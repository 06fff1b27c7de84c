import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import type { AuditDto, ElectionDto } from '@veracast/shared-types';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderWithClient, stubApi } from '../../../test/render';
import { CreateAuditForm } from './CreateAuditForm';

function buildElection(overrides: Partial<ElectionDto> = {}): ElectionDto {
  return {
    key: 'e-2026', name: 'General election 2026', date: '2026-10-18', jurisdiction: 'X', fictional: true,
    blocA: 'A', blocB: 'B', orientationSource: 'default', blackoutStart: null, blackoutEnd: null,
    contestCount: 3, certifiedCount: 3, pollCount: 40,
    ...overrides,
  };
}

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('CreateAuditForm', () => {
  it('sends the chosen elections with the default settings', async () => {
    const requests = stubApi({
      'GET /elections': () => jsonResponse(200, { items: [buildElection(), buildElection({ key: 'e-2022', name: 'General election 2022', date: '2022-05-15' })] }),
      'POST /audits': () => jsonResponse(201, { id: 42 }),
    });
    const onCreated = vi.fn();
    renderWithClient(<CreateAuditForm onCreated={onCreated} />);
    fireEvent.click(await screen.findByRole('checkbox', { name: /General election 2022/ }));
    fireEvent.change(screen.getByLabelText('Audit name'), { target: { value: 'Post-mortem 2022' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create audit' }));
    await waitFor(() => expect(onCreated).toHaveBeenCalled());
    expect((onCreated.mock.calls[0]![0] as AuditDto).id).toBe(42);
    // [practice] SPEC §5 defaults: 21-day window, final polls only, raw shares, 5 polls to rank
    expect(requests.find((r) => r.method === 'POST')?.body).toEqual({
      name: 'Post-mortem 2022', electionKeys: ['e-2022'], windowDays: 21, finalOnly: true, undecided: 'raw', minPolls: 5, designEffect: 1,
    });
  });

  it('refuses to send without an election', async () => {
    const requests = stubApi({ 'GET /elections': () => jsonResponse(200, { items: [buildElection()] }) });
    renderWithClient(<CreateAuditForm onCreated={vi.fn()} />);
    await screen.findByRole('checkbox', { name: /General election 2026/ });
    fireEvent.change(screen.getByLabelText('Audit name'), { target: { value: 'Nothing chosen' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create audit' }));
    expect(await screen.findByText('choose at least one election')).toBeTruthy();
    expect(requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it('says when the elections cannot be loaded and takes keys typed by hand', async () => {
    const requests = stubApi({ 'POST /audits': () => jsonResponse(201, { id: 5 }) });
    const onCreated = vi.fn();
    renderWithClient(<CreateAuditForm onCreated={onCreated} />);
    expect(await screen.findByText('The list of elections could not be loaded')).toBeTruthy();
    fireEvent.change(screen.getByLabelText('Election keys'), { target: { value: 'cal-2026-general, cal-2022-general' } });
    fireEvent.change(screen.getByLabelText('Audit name'), { target: { value: 'Typed keys' } });
    fireEvent.change(screen.getByLabelText('Window (days before election day)'), { target: { value: '14' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create audit' }));
    await waitFor(() => expect(onCreated).toHaveBeenCalled());
    expect(requests.find((r) => r.method === 'POST')?.body).toMatchObject({ electionKeys: ['cal-2026-general', 'cal-2022-general'], windowDays: 14 });
  });
});
