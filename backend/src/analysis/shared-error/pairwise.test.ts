import { describe, expect, it } from 'vitest';
import { pearson } from './correlation';
import type { FirmContestError } from './house-effects';
import { pairwiseFirmCorrelations } from './pairwise';
import { deepFreeze, expectClose, expectInputError, nonFinitePaths } from './testing';

const poll = (contestKey: string, firm: string, error: number): FirmContestError => ({ contestKey, firm, error });

/** Firms A and B poll c1..c6; C polls c1..c4 only; D polls c1 and c2 only. */
function buildPolls(): FirmContestError[] {
  const a = [1.0, -0.5, 2.0, 0.3, 1.4, -1.2];
  const b = [0.8, 0.2, 1.1, -0.4, 1.9, -0.7];
  const c = [0.5, -0.9, 1.6, 0.0];
  const d = [2.0, -1.0];
  return [
    ...a.map((e, i) => poll(`c${i + 1}`, 'A', e)),
    ...b.map((e, i) => poll(`c${i + 1}`, 'B', e)),
    ...c.map((e, i) => poll(`c${i + 1}`, 'C', e)),
    ...d.map((e, i) => poll(`c${i + 1}`, 'D', e)),
  ];
}

describe('pairwiseFirmCorrelations', () => {
  it('correlates each pair over common contests and flags thin pairs with nulls', () => {
    const polls = deepFreeze(buildPolls());
    const pairs = pairwiseFirmCorrelations(polls, { minCommon: 4 });
    expect(pairs.map((p) => `${p.a}-${p.b}`)).toEqual(['A-B', 'A-C', 'A-D', 'B-C', 'B-D', 'C-D']);
    const ab = pairs[0];
    expect(ab?.n).toBe(6);
    expect(ab?.insufficient).toBe(false);
    // same numbers as pearson over the six common contests [practice: two formulations agree]
    expectClose(ab?.pearson, pearson([1.0, -0.5, 2.0, 0.3, 1.4, -1.2], [0.8, 0.2, 1.1, -0.4, 1.9, -0.7]).r, 1e-12);
    const ad = pairs.find((p) => p.a === 'A' && p.b === 'D');
    expect(ad?.n).toBe(2);
    expect(ad?.insufficient).toBe(true);
    expect(ad?.pearson).toBeNull();
    expect(ad?.spearman).toBeNull();
    expect(ad?.pearsonAdjusted).toBeNull();
    expect(ad?.note).toMatch(/only 2 common contests/);
    expect(nonFinitePaths(pairs)).toEqual([]);
  });

  it('removes the other firms’ contest bias for the adjusted correlation and drops uncovered contests', () => {
    const pairs = pairwiseFirmCorrelations(buildPolls(), { minCommon: 4 });
    const ab = pairs[0];
    // c5 and c6 were polled by A and B only: they drop out of the adjusted correlation.
    expect(ab?.nAdjusted).toBe(4);
    // other firms' bias: c1 mean(0.5, 2.0) = 1.25, c2 mean(−0.9, −1.0) = −0.95, c3 1.6, c4 0.0
    const bias = [1.25, -0.95, 1.6, 0.0];
    const expected = pearson(
      [1.0, -0.5, 2.0, 0.3].map((e, i) => e - (bias[i] as number)),
      [0.8, 0.2, 1.1, -0.4].map((e, i) => e - (bias[i] as number)),
    );
    expectClose(ab?.pearsonAdjusted, expected.r, 1e-12);
    expectClose(ab?.pearsonAdjustedP, expected.p, 1e-12);
  });

  it('keeps the raw correlation but nulls the adjusted one when too few contests have a third firm', () => {
    const pairs = pairwiseFirmCorrelations(buildPolls(), { minCommon: 5 });
    const ab = pairs[0];
    expect(ab?.insufficient).toBe(false);
    expect(ab?.pearson).not.toBeNull();
    expect(ab?.pearsonAdjusted).toBeNull();
    expect(ab?.note).toMatch(/adjusted/);
  });

  it('averages several polls of one firm in one contest into one error', () => {
    const base = buildPolls();
    const split = [
      ...base.filter((p) => !(p.firm === 'A' && p.contestKey === 'c1')),
      poll('c1', 'A', 0.0),
      poll('c1', 'A', 2.0), // mean 1.0, as in buildPolls
    ];
    const r1 = pairwiseFirmCorrelations(base, { minCommon: 4 })[0];
    const r2 = pairwiseFirmCorrelations(split, { minCommon: 4 })[0];
    expect(r2?.n).toBe(6);
    expectClose(r2?.pearson, r1?.pearson as number, 1e-12);
  });

  it('returns nulls with a note, never NaN, when a firm’s errors do not vary', () => {
    const polls = [1, 2, 3, 4, 5].flatMap((c) => [poll(`c${c}`, 'A', 1.5), poll(`c${c}`, 'B', c * 0.7)]);
    const [ab] = pairwiseFirmCorrelations(polls);
    expect(ab?.pearson).toBeNull();
    expect(ab?.spearman).toBeNull();
    expect(ab?.note).toMatch(/same error/);
    expect(nonFinitePaths(ab)).toEqual([]);
  });

  it('returns no pairs for a single firm', () => {
    expect(pairwiseFirmCorrelations([poll('c1', 'A', 1), poll('c2', 'A', 2)])).toEqual([]);
  });

  it('throws MetricInputError naming the parameter on degenerate input', () => {
    expectInputError(() => pairwiseFirmCorrelations([]), 'polls');
    expectInputError(() => pairwiseFirmCorrelations([poll('c1', 'A', Number.NaN)]), 'polls[0].error');
    expectInputError(() => pairwiseFirmCorrelations(buildPolls(), { minCommon: 2 }), 'options.minCommon');
    expectInputError(() => pairwiseFirmCorrelations(buildPolls(), { minCommon: 4.5 }), 'options.minCommon');
  });
});
