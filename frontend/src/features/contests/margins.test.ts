import type { AuditPollDto } from '@veracast/shared-types';
import { describe, expect, it } from 'vitest';
import type { ContestPoll } from './api/list-contest-polls';
import { certifiedMargin, fieldworkMidpoint, marginPoints, pollMargin } from './margins';

function poll(key: string, shares: Record<string, number>, metrics: Partial<AuditPollDto> | null = null, dates = ['2022-05-01', '2022-05-04']): ContestPoll {
  return {
    key,
    pollsterId: 1,
    pollster: 'Firm',
    sponsor: null,
    sponsorType: null,
    contestKey: 'c',
    electionKey: 'e',
    fieldworkStart: dates[0]!,
    fieldworkEnd: dates[1]!,
    publishedOn: '2022-05-06',
    sampleSize: 1000,
    population: 'lv',
    mode: 'online',
    moe: null,
    studyKey: null,
    isHeadline: true,
    tracking: false,
    sourceUrl: null,
    tablesUrl: null,
    questionWording: false,
    weightingStatement: false,
    shares,
    disclosure: { items: {} as ContestPoll['disclosure']['items'], completeness: 0.5 },
    fictional: true,
    metrics: metrics as AuditPollDto | null,
  };
}

const contest = {
  refA: 'oak',
  refB: 'lantern',
  status: 'certified' as const,
  options: [
    { key: 'oak', name: 'Oak', bloc: 'OAK', votes: 400, share: 40 },
    { key: 'lantern', name: 'Lantern', bloc: 'LAN', votes: 350, share: 35 },
    { key: 'other', name: 'Other', bloc: null, votes: 250, share: 25 },
  ],
};

describe('fieldworkMidpoint', () => {
  it('takes the day halfway through fieldwork, rounding down', () => {
    // [practice] hand arithmetic: 1 May + floor(3 / 2) days = 2 May; 1 May + 4 / 2 days = 3 May
    expect(fieldworkMidpoint('2022-05-01', '2022-05-04')).toBe('2022-05-02');
    expect(fieldworkMidpoint('2022-05-01', '2022-05-05')).toBe('2022-05-03');
    // [practice] across a month end: 28 Feb + floor(4 / 2) = 2 Mar in 2022 (not a leap year)
    expect(fieldworkMidpoint('2022-02-28', '2022-03-04')).toBe('2022-03-02');
  });
});

describe('pollMargin', () => {
  it('uses the metrics when the server computed them, else the published shares', () => {
    // [practice] hand arithmetic: 42.5 − 40 = 2.5 from the metrics; 38 − 36 = 2 from the shares
    expect(pollMargin(poll('p', { oak: 38, lantern: 36 }, { pollA: 42.5, pollB: 40 }), 'oak', 'lantern')).toBeCloseTo(2.5, 10);
    expect(pollMargin(poll('p', { oak: 38, lantern: 36 }), 'oak', 'lantern')).toBeCloseTo(2, 10);
    expect(pollMargin(poll('p', { oak: 38 }), 'oak', 'lantern')).toBeNull();
  });
});

describe('certifiedMargin', () => {
  it('follows the metrics (the treatment) when present and the contest shares otherwise', () => {
    // [practice] hand arithmetic: 40 − 35 = 5 points; two-party 53.3 − 46.7 = 6.6
    expect(certifiedMargin(contest, [])).toBeCloseTo(5, 10);
    expect(certifiedMargin(contest, [poll('p', {}, { resultA: 53.3, resultB: 46.7 })])).toBeCloseTo(6.6, 10);
  });

  it('draws no certified line for a result that is not certified', () => {
    expect(certifiedMargin({ ...contest, status: 'provisional' }, [])).toBeNull();
  });
});

describe('marginPoints', () => {
  it('keeps the polls with both shares, in fieldwork order', () => {
    const points = marginPoints(contest, [
      poll('late', { oak: 40, lantern: 30 }, null, ['2022-05-08', '2022-05-10']),
      poll('early', { oak: 30, lantern: 40 }),
      poll('partial', { oak: 30 }),
    ]);
    expect(points.map((p) => p.pollKey)).toEqual(['early', 'late']);
    expect(points.map((p) => p.margin)).toEqual([-10, 10]);
  });
});
