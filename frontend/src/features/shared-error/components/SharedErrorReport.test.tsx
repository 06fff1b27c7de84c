import { cleanup, fireEvent, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderWithClient, stubApi } from '../../../test/render';
import { buildAuditPoll, buildEmptyAnalysis, buildSharedMissAnalysis } from '../testing';
import type { SharedErrorAnalysisDto } from '../types';
import { SharedErrorReport } from './SharedErrorReport';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const ELECTION = 'demo-2022-general';

function serve(analysis: SharedErrorAnalysisDto, polls = [buildAuditPoll()]) {
  return stubApi({
    [`GET /audits/7/shared-error?election=${ELECTION}`]: () => jsonResponse(200, analysis),
    [`GET /audits/7/polls?election=${ELECTION}&used=true`]: () => jsonResponse(200, { items: polls, total: polls.length }),
  });
}

function pageText(): string {
  return document.body.textContent ?? '';
}

describe('SharedErrorReport', () => {
  it('flags a shared miss with its size, direction and blocs', async () => {
    serve(buildSharedMissAnalysis(), [
      buildAuditPoll({ pollKey: 'n1', marginError: -5.5 }),
      buildAuditPoll({ pollKey: 'n2', pollster: 'Birch Surveys', marginError: -4.5 }),
    ]);
    renderWithClient(<SharedErrorReport auditId={7} electionKey={ELECTION} blocs={{ blocA: 'OAK', blocB: 'LAN' }} />);

    const flag = await screen.findByRole('region', { name: 'Shared miss: most firms missed the same way' });
    expect(within(flag).getByText('\u22124.3 pts')).toBeTruthy();
    expect(within(flag).getAllByText('polls understated OAK against LAN').length).toBeGreaterThan(0);
    expect(within(flag).getByText('3 of 3')).toBeTruthy();
    // the chart's data table lists both polls of the north contest
    expect(await screen.findByRole('table', { name: 'Each poll’s error and its contest’s mean' })).toBeTruthy();
    expect(pageText()).not.toMatch(/NaN|undefined/);
  });

  it('prints r in each cell of the firm-by-firm grid, and the count of common contests where r is missing', async () => {
    serve(buildSharedMissAnalysis());
    renderWithClient(<SharedErrorReport auditId={7} electionKey={ELECTION} blocs={{ blocA: 'OAK', blocB: 'LAN' }} />);

    const grid = await screen.findByRole('img', { name: /Correlation of firms’ errors over common contests \(raw\)/ });
    const cells = () => [...grid.querySelectorAll('text')].map((t) => t.textContent);
    // each pair appears twice (above and below the diagonal)
    expect(cells().filter((t) => t === '0.71')).toHaveLength(2);
    expect(cells().filter((t) => t === 'n=2')).toHaveLength(2);
    expect([...grid.querySelectorAll('title')].map((t) => t.textContent)).toContain(
      'Alder Polling × Birch Surveys: not computed (only 2 common contests; at least 5 are needed)',
    );

    fireEvent.click(screen.getByLabelText('After removing each contest’s bias (estimated from the other firms)'));
    const adjusted = await screen.findByRole('img', { name: /after removing contest bias/ });
    expect([...adjusted.querySelectorAll('text')].filter((t) => t.textContent === '\u22120.35')).toHaveLength(2);
  });

  it('shows "not enough data" with reasons, and never NaN, when nothing could be computed', async () => {
    serve(buildEmptyAnalysis(), []);
    renderWithClient(<SharedErrorReport auditId={7} electionKey={ELECTION} blocs={{ blocA: null, blocB: null }} />);

    expect(await screen.findByRole('heading', { name: 'Not enough data to judge a shared miss' })).toBeTruthy();
    const text = pageText();
    expect(text).toContain('not enough data');
    expect(text).toContain('There are no polls with a usable signed error, so nothing could be computed.');
    expect(text).not.toMatch(/NaN|undefined|Infinity/);
  });

  it('explains the missing test for an election with a single contest', async () => {
    const warning = 'Only one contest has polls: the mean error cannot be tested with contest-clustered standard errors, which need at least 2 contests.';
    serve(
      buildSharedMissAnalysis({
        contests: 1, p: null, t: null, df: null, clusteredSe: null, ciLow: null, ciHigh: null, icc: null, iccF: null, iccP: null, iccDf: null,
        errorStructure: null, varianceSplit: null, varianceComponents: null, pairs: [],
        contestsDetail: buildSharedMissAnalysis().contestsDetail.slice(0, 1).map((c) => ({ ...c, adjustedSe: null, nEff: null, adjustedCovered: null })),
        warnings: [warning, 'The intraclass correlation needs polls in at least 2 contests.'],
      }),
    );
    renderWithClient(<SharedErrorReport auditId={7} electionKey={ELECTION} blocs={{ blocA: 'YES', blocB: 'NO' }} />);

    const region = await screen.findByRole('region', { name: 'No test of a shared miss: too few contests' });
    expect(within(region).getAllByText(warning).length).toBeGreaterThan(0);
    expect(pageText()).toContain('Only 1 contest in this election');
    expect(pageText()).not.toMatch(/NaN|undefined|Infinity/);
  });

  it('says so when the analysis cannot be loaded', async () => {
    stubApi({});
    renderWithClient(<SharedErrorReport auditId={7} electionKey={ELECTION} blocs={{ blocA: 'OAK', blocB: 'LAN' }} />);
    expect(await screen.findByText('The analysis could not be loaded')).toBeTruthy();
  });
});
