import { cleanup, screen } from '@testing-library/react';
import type { AuditDto } from '@veracast/shared-types';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderWithClient, stubApi } from '../../../test/render';
import { FirmAccuracyPanel, type FirmChartsData } from './FirmAccuracyPanel';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const AUDIT = {
  id: 3, name: 'Spring audit', settings: { name: 'Spring audit', electionKeys: ['e1'], windowDays: 21, finalOnly: true, undecided: 'raw', minPolls: 5, designEffect: 1 },
  dataHash: 'abc', coreVersion: '1', pollCount: 2, createdAt: '2026-05-01T00:00:00Z', createdBy: null, rerunOf: null, outOfDate: false, currentHash: 'abc',
  elections: [{ key: 'e1', name: 'First election', date: '2026-04-01', blocA: 'Blue', blocB: 'Red', fictional: true }],
  headline: { pollsUsed: 2, pollsTotal: 2, meanAbsMarginError: 2, meanSignedError: 1, meanSignedErrorInterval: null, signedDirection: null, marginCoverage: 1, shareCoverage: 1, winnerCalledRate: 1, calls: 2, noCalls: 0, notComputable: 0 },
  fictional: true,
} satisfies AuditDto;

const ITEM = {
  pollsterId: 5, pollster: 'Aster Polling', polls: 6, contests: 6, elections: 1, meanAbsMarginError: 2.5, meanSignedError: 1.25, meanSignedErrorInterval: [0.5, 2],
  rmse: 3, winnerCalledRate: 0.8, calls: 5, noCalls: 1, coverageRate: 0.5, coverageN: 6, shareCoverageRate: 0.5, disclosure: 0.9, excessError: -0.4,
  excessErrorShrunk: -0.1, excessErrorInterval: [-1, 0.3], excessErrorShrunkInterval: [-0.6, 0.2], rank: 2, rankInterval: [1, 4], pRankFirst: 0.3, ranked: true, reason: null,
};

describe('FirmAccuracyPanel', () => {
  it('shows the newest audit’s scorecard, hands the polls to the charts, and says when the firm’s profile cannot load', async () => {
    stubApi({
      'GET /audits': () => jsonResponse(200, { items: [{ ...AUDIT }], total: 1 }),
      'GET /audits/3': () => jsonResponse(200, AUDIT),
      'GET /audits/3/scorecards': () => jsonResponse(200, { items: [ITEM], field: { ranked: 4, fieldMeanAbsMarginError: 3, fieldMeanSignedError: 0.5, nominalCoverage: 0.95, shrinkage: { applied: true, note: null, sigma2: 1, tau2: 0.2, mu: 0 } }, total: 1, filtered: false }),
      'GET /audits/3/polls?pollster=5': () => jsonResponse(200, { items: [{ pollKey: 'mine' }], total: 1 }),
      'GET /audits/3/polls?used=true': () => jsonResponse(200, { items: [{ pollKey: 'mine' }, { pollKey: 'theirs' }], total: 2 }),
      'GET /pollsters/5': () => jsonResponse(503, { error: { code: 'unavailable', message: 'The database is down.' } }),
    });
    const charts = vi.fn((data: FirmChartsData) => <p>charts for {data.fieldPolls.length} field polls</p>);
    renderWithClient(<FirmAccuracyPanel pollsterId={5} renderCharts={charts} />);

    expect(await screen.findByText('charts for 2 field polls')).toBeTruthy();
    const data = charts.mock.calls.at(-1)![0];
    expect(data.auditId).toBe(3);
    expect(data.firmPolls.map((p) => p.pollKey)).toEqual(['mine']);
    expect(data.elections[0]?.blocA).toBe('Blue');

    expect((screen.getByLabelText('Audit') as HTMLSelectElement).value).toBe('3');
    expect(screen.getByText('Fictional demo data')).toBeTruthy();
    expect(await screen.findByRole('img', { name: 'Rank 2 of 4, 95% interval 1 to 4' })).toBeTruthy();
    expect(screen.getByRole('img', { name: 'Excess error −0.10 points, 95% interval −0.60 to 0.20' })).toBeTruthy();
    expect(screen.getByText('+1.3 pts')).toBeTruthy();
    expect(await screen.findByText('The database is down.')).toBeTruthy();
  });

  it('says so when there is no audit yet', async () => {
    stubApi({ 'GET /audits': () => jsonResponse(200, { items: [], total: 0 }), 'GET /pollsters/5': () => jsonResponse(404, { error: { code: 'not_found', message: 'Pollster not found' } }) });
    renderWithClient(<FirmAccuracyPanel pollsterId={5} />);
    expect(await screen.findByText('No audits yet')).toBeTruthy();
    expect(screen.queryByLabelText('Audit')).toBeNull();
  });
});
