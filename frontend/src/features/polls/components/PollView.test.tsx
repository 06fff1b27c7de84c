import { cleanup, screen, within } from '@testing-library/react';
import type { ContestDto } from '@veracast/shared-types';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderWithClient, stubApi } from '../../../test/render';
import type { PollDetail, PollTreatmentMetrics } from '../api/get-poll';
import { PollView } from './PollView';

function buildMetrics(overrides: Partial<PollTreatmentMetrics> = {}): PollTreatmentMetrics {
  return {
    refA: 'lantern', refB: 'oak', refBasis: 'blocs', pollA: 48, pollB: 44, resultA: 50.2, resultB: 47.3, nEff: 1067, nEffBasis: 'stated_moe',
    marginError: 1.1, absMarginError: 1.1, lean: 'A', twoPartyShareError: 0.686734, mosteller3: 1.7, mosteller5: 1.1,
    mtkA: 0.02, mtkSe: 0.06, mtkP: 0.7, aeB: 0.05, aeBw: 0.04, winnerCalled: true, shareCovered: true, marginCovered: true,
    daysOut: 4.5, daysOutEnd: 3, undecidedShare: 6, notes: ['The scored set leaves out undecided.'], error: null,
    ...overrides,
  };
}

const contest: ContestDto = {
  key: 'c-national', name: 'National vote', kind: 'candidate', electionKey: 'e-2026', electionName: 'General election 2026', electionDate: '2026-10-18',
  fictional: true, status: 'certified', certifiedOn: '2026-10-30', certifyingBody: null, sourceUrl: null, validVotes: 1000, rejectedBallots: null,
  electorate: null, turnout: null, pollCount: 3, refA: 'lantern', refB: 'oak',
  options: [
    { key: 'lantern', name: 'Lantern Party', bloc: 'LAN', votes: 502, share: 50.2 },
    { key: 'oak', name: 'Oakbound Union', bloc: 'OAK', votes: 473, share: 47.3 },
  ],
};

const poll: PollDetail = {
  key: 'p-1', pollsterId: 1, pollster: 'Aster Polling', sponsor: null, sponsorType: null, contestKey: 'c-national', electionKey: 'e-2026',
  fieldworkStart: '2026-10-10', fieldworkEnd: '2026-10-15', publishedOn: '2026-10-16', sampleSize: 1000, population: 'lv', mode: 'online', moe: 3,
  studyKey: null, isHeadline: true, tracking: false, sourceUrl: null, tablesUrl: null, questionWording: false, weightingStatement: false, shares: { lantern: 48, oak: 44, undecided: 8 },
  disclosure: { items: {} as PollDetail['disclosure']['items'], completeness: 0.6 }, fictional: true, contest,
  metrics: {
    raw: buildMetrics(),
    // [computed] METHODS §1 check case 1: proportional e +1.355319; two-party margin error = 2 × 0.686734
    proportional: buildMetrics({ marginError: 1.355319, absMarginError: 1.355319 }),
    two_party: buildMetrics({ marginError: 1.373468, absMarginError: 1.373468 }),
  },
};

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('PollView', () => {
  it('lists every metric under each treatment with its inputs, marks the audit’s treatment and says shared notes once', async () => {
    stubApi({ 'GET /polls/p-1': () => jsonResponse(200, poll) });
    renderWithClient(<PollView pollKey="p-1" highlight="proportional" explain={(anchor) => <a href={`#${anchor}`}>Formula</a>} />);
    const table = await screen.findByRole('table', { name: /Metrics of the poll/ });
    const row = within(table).getByRole('row', { name: /Signed margin error/ });
    expect(within(row).getAllByRole('cell').map((c) => c.textContent)).toEqual(['+1.10', '+1.36', '+1.37']);
    expect(within(table).getByRole('columnheader', { name: /Proportional/ }).textContent).toMatch(/the audit’s treatment/);
    expect(within(within(table).getByRole('row', { name: /Poll share of A/ })).getAllByRole('cell')[0]!.textContent).toBe('48.00');
    expect(screen.getAllByText('The scored set leaves out undecided.')).toHaveLength(1);
    expect(screen.getByText('Every treatment:')).toBeTruthy();
    expect(screen.getByText('Fictional demo data')).toBeTruthy();
  });

  it('says so when the poll does not exist', async () => {
    stubApi({});
    renderWithClient(<PollView pollKey="p-missing" explain={() => null} />);
    expect(await screen.findByText('This poll was not found')).toBeTruthy();
  });
});
