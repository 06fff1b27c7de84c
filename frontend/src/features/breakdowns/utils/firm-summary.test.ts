import type { AuditPollDto } from '@veracast/shared-types';
import { describe, expect, it } from 'vitest';
import { absErrorHistogram, firmElectionRows, leanWords, type ElectionInfo } from './firm-summary';

function buildPoll(overrides: Partial<AuditPollDto>): AuditPollDto {
  const marginError = overrides.marginError ?? 0;
  return {
    pollKey: 'p', contestKey: 'c1', electionKey: 'e1', pollsterId: 1, pollster: 'Firm One', refA: 'a', refB: 'b', refBasis: 'blocs',
    marginError, absMarginError: Math.abs(marginError), lean: 'none', mosteller3: null, mosteller5: null, mtkA: null, mtkSe: null, mtkP: null,
    aeB: null, aeBw: null, winnerCalled: true, shareCovered: true, marginCovered: true, daysOut: 3, daysOutEnd: 2, undecidedShare: 5,
    twoPartyShareError: null, inWindow: true, isFinal: true, fieldworkEnd: '2026-05-01', sampleSize: 1000, population: 'lv', mode: 'phone',
    sponsorType: 'media', disclosure: 0.8, nEff: 1000, pollA: 45, pollB: 44, resultA: 46, resultB: 42, notes: [], error: null,
    ...overrides,
  };
}

const ELECTIONS: ElectionInfo[] = [
  { key: 'e2', name: 'Second', date: '2026-06-01', blocA: 'Blue', blocB: 'Red' },
  { key: 'e1', name: 'First', date: '2022-06-01', blocA: 'Blue', blocB: 'Red' },
];

const FIELD = Object.freeze([
  buildPoll({ pollKey: 'f1-a', pollsterId: 1, electionKey: 'e1', marginError: 2 }),
  buildPoll({ pollKey: 'f1-b', pollsterId: 1, electionKey: 'e1', marginError: -1 }),
  buildPoll({ pollKey: 'f2-a', pollsterId: 2, electionKey: 'e1', marginError: -4 }),
  buildPoll({ pollKey: 'f2-b', pollsterId: 2, electionKey: 'e2', marginError: 3 }),
  // Not oriented by the election's blocs: counts for the absolute mean only.
  buildPoll({ pollKey: 'f1-c', pollsterId: 1, electionKey: 'e2', marginError: 6, refBasis: 'top_two' }),
  // Not computable: left out everywhere.
  buildPoll({ pollKey: 'f1-d', pollsterId: 1, electionKey: 'e2', marginError: null, absMarginError: null, error: 'no result' }),
]);

describe('firmElectionRows', () => {
  it('gives the firm’s and the field’s means per election in date order', () => {
    const rows = firmElectionRows(1, FIELD, ELECTIONS);
    expect(rows.map((r) => r.electionKey)).toEqual(['e1', 'e2']);
    const [first, second] = rows;
    expect(first?.firmPolls).toBe(2);
    // [computed] by hand: firm (2 + −1)/2 = 0.5; field (2 − 1 − 4)/3 = −1; firm − field = 1.5
    expect(first?.firmMeanSigned).toBeCloseTo(0.5, 12);
    expect(first?.fieldMeanSigned).toBeCloseTo(-1, 12);
    expect(first?.difference).toBeCloseTo(1.5, 12);
    // [computed] by hand: absolute means firm (2 + 1)/2 = 1.5, field (2 + 1 + 4)/3 = 7/3
    expect(first?.firmMeanAbs).toBeCloseTo(1.5, 12);
    expect(first?.fieldMeanAbs).toBeCloseTo(7 / 3, 12);
    // e2: the firm's only computable poll is not bloc-oriented, so it has no signed mean.
    expect(second?.firmPolls).toBe(1);
    expect(second?.firmSignedPolls).toBe(0);
    expect(second?.firmMeanSigned).toBeNull();
    expect(second?.firmMeanAbs).toBe(6);
    expect(second?.fieldMeanSigned).toBe(3);
    expect(second?.difference).toBeNull();
  });

  it('does not change its inputs', () => {
    const elections = Object.freeze(ELECTIONS.map((e) => Object.freeze({ ...e })));
    expect(() => firmElectionRows(1, FIELD, elections)).not.toThrow();
    expect(elections[0]?.key).toBe('e2');
  });
});

describe('absErrorHistogram', () => {
  it('counts absolute errors in 1-point bands with an open top band', () => {
    const bins = absErrorHistogram(1, FIELD, 5);
    expect(bins.map((b) => b.label)).toEqual(['0–1', '1–2', '2–3', '3–4', '4–5', '5+']);
    // [computed] by hand: computable field errors |2|, |−1|, |−4|, |3|, |6| → bands 2–3, 1–2, 4–5, 3–4, 5+
    expect(bins.map((b) => b.field)).toEqual([0, 1, 1, 1, 1, 1]);
    // firm 1: 2, 1, 6 → bands 2–3, 1–2, 5+; shares of its 3 polls
    expect(bins.map((b) => b.firm)).toEqual([0, 1, 1, 0, 0, 1]);
    expect(bins[1]?.firmShare).toBeCloseTo(1 / 3, 12);
    expect(bins[1]?.fieldShare).toBeCloseTo(1 / 5, 12);
    expect(bins.reduce((s, b) => s + b.fieldShare, 0)).toBeCloseTo(1, 12);
  });

  it('puts a value on a band edge in the upper band', () => {
    const bins = absErrorHistogram(9, [buildPoll({ marginError: 1 })], 3);
    expect(bins.map((b) => b.field)).toEqual([0, 1, 0, 0]);
    expect(bins.every((b) => b.firmShare === 0)).toBe(true);
  });
});

describe('leanWords', () => {
  const pts = (x: number) => x.toFixed(1);
  it('names the direction against the election’s blocs (positive overstated bloc A)', () => {
    expect(leanWords(2.04, 'Blue', 'Red', pts)).toBe('overstated Blue against Red by 2.0');
    expect(leanWords(-0.5, 'Blue', 'Red', pts)).toBe('understated Blue against Red by 0.5');
    expect(leanWords(0, 'Blue', 'Red', pts)).toBe('no lean');
    expect(leanWords(null, null, null, pts)).toBe('no signed error');
    expect(leanWords(1, null, null, pts)).toBe('overstated bloc A against bloc B by 1.0');
  });
});
