import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderWithClient, stubApi } from '../../../test/render';
import type { ContestDetail } from '../api/get-contest';
import { ResultForm } from './ResultForm';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function buildContest(overrides: Partial<ContestDetail> = {}): ContestDetail {
  return {
    key: 'cal-2026-mayor',
    name: 'Mayor',
    kind: 'candidate',
    electionKey: 'cal-2026',
    electionName: 'Cal 2026',
    electionDate: '2026-05-03',
    fictional: false,
    status: 'certified',
    certifiedOn: '2026-05-20',
    certifyingBody: null,
    sourceUrl: 'https://results.example.org/mayor',
    validVotes: 1000,
    rejectedBallots: null,
    electorate: null,
    turnout: null,
    options: [
      { key: 'ann', name: 'Ann Aster', bloc: 'A', votes: 600, share: 60 },
      { key: 'bo', name: 'Bo Birch', bloc: 'B', votes: 400, share: 40 },
    ],
    pollCount: 0,
    refA: 'ann',
    refB: 'bo',
    history: [],
    hasSourceDocument: false,
    ...overrides,
  };
}

describe('ResultForm', () => {
  it('shows an analyst that a certified result needs a reviewer, with no form', () => {
    stubApi({});
    renderWithClient(<ResultForm contest={buildContest()} canCertify={false} />);
    expect(screen.getByText('This result is certified')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Save result/ })).toBeNull();
  });

  it('does not let an analyst choose the certified status', () => {
    stubApi({});
    renderWithClient(<ResultForm contest={buildContest({ status: 'provisional', certifiedOn: null })} canCertify={false} />);
    const certified = screen.getByRole('option', { name: 'Certified' }) as HTMLOptionElement;
    expect(certified.disabled).toBe(true);
  });

  it('asks a reviewer for a reason before changing a certified result, then sends it with the votes', async () => {
    const requests = stubApi({ 'PUT /contests/cal-2026-mayor/result': () => jsonResponse(200, buildContest()) });
    renderWithClient(<ResultForm contest={buildContest()} canCertify />);

    fireEvent.change(screen.getByLabelText('Votes for Bo Birch'), { target: { value: '410' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save result' }));
    expect(await screen.findByText('changing a certified result needs a reason')).toBeTruthy();
    expect(requests).toHaveLength(0);

    fireEvent.change(screen.getByLabelText('Reason for the change (required)'), { target: { value: 'Recount in ward 4' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save result' }));
    await waitFor(() => expect(requests).toHaveLength(1));
    expect(requests[0]?.body).toMatchObject({ status: 'certified', reason: 'Recount in ward 4', votes: { ann: 600, bo: 410 } });
  });

  it('refuses to certify without a source, with the shared schema message on the field', async () => {
    const requests = stubApi({});
    renderWithClient(<ResultForm contest={buildContest({ status: 'provisional', certifiedOn: null, sourceUrl: null })} canCertify />);
    fireEvent.change(screen.getByLabelText('Status'), { target: { value: 'certified' } });
    fireEvent.change(screen.getByLabelText('Certified on'), { target: { value: '2026-05-21' } });
    fireEvent.click(screen.getByRole('button', { name: 'Certify result' }));
    expect(await screen.findByText('a certified result needs a source')).toBeTruthy();
    expect(requests).toHaveLength(0);
  });

  it('shows a vote count that is not a whole number on its own field', async () => {
    const requests = stubApi({});
    renderWithClient(<ResultForm contest={buildContest({ status: 'provisional', certifiedOn: null })} canCertify={false} />);
    fireEvent.change(screen.getByLabelText('Votes for Ann Aster'), { target: { value: '12.5' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save result' }));
    expect(await screen.findByText('votes must be whole numbers')).toBeTruthy();
    expect(requests).toHaveLength(0);
  });
});
