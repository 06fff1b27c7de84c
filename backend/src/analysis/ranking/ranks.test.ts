import { describe, expect, it } from 'vitest';
import { averageRanks } from './ranks';
import { deepFreeze, expectInputError } from './testHelpers';

describe('averageRanks', () => {
  it('gives rank 1 to the smallest value and averages ties', () => {
    // [practice] hand: sorted 0.4 (1), 1.0 (2), 3.2 and 3.2 share positions 3–4 → 3.5
    expect(averageRanks([3.2, 1.0, 3.2, 0.4])).toEqual([3.5, 2, 3.5, 1]);
    // [practice] hand: three-way tie over positions 1–3 → 2 each
    expect(averageRanks([5, 5, 5])).toEqual([2, 2, 2]);
    // [practice] hand: one value → rank 1
    expect(averageRanks([-7])).toEqual([1]);
  });

  it('ranks sum to k(k+1)/2 and ranks follow the order of values', () => {
    const xs = [0.3, -1, 2, 2, 2, 0.3, 9, -4, 0];
    const r = averageRanks(xs);
    // [practice] invariant: Σ ranks = k(k+1)/2 = 9·10/2 = 45
    expect(r.reduce((a, b) => a + b, 0)).toBe(45);
    for (let i = 0; i < xs.length; i += 1) {
      for (let j = 0; j < xs.length; j += 1) {
        if ((xs[i] as number) < (xs[j] as number)) expect(r[i] as number).toBeLessThan(r[j] as number);
        if (xs[i] === xs[j]) expect(r[i]).toBe(r[j]);
      }
    }
  });

  it('does not mutate its input', () => {
    const xs = deepFreeze([2, 1, 3]);
    expect(averageRanks(xs)).toEqual([2, 1, 3]);
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => averageRanks([]), 'values');
    expectInputError(() => averageRanks([1, Number.NaN]), 'values[1]');
    expectInputError(() => averageRanks([Infinity]), 'values[0]');
    expectInputError(() => averageRanks(null as unknown as number[]), 'values');
  });
});
