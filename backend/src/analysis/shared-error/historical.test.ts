import { describe, expect, it } from 'vitest';
import { Z95 } from '../distributions';
import { historicalAverageInterval, tooCloseToCall } from './historical';
import { deepFreeze, expectClose, expectInputError } from './testing';

describe('historicalAverageInterval', () => {
  it('combines an RMSE-based and an empirical 95% half-width, keeping the larger', () => {
    const r = historicalAverageInterval(deepFreeze([1, -2, 3, -4]));
    // [practice: hand arithmetic] RMSE = √(30/4) = 2.738613; |miss| sorted (1, 2, 3, 4),
    // 95th percentile at position 0.95·3 = 2.85 → 3.85 (numpy.percentile default, see reference.json)
    expectClose(r.rmse, Math.sqrt(7.5), 1e-12);
    expectClose(r.rmseHalfWidth, Z95 * Math.sqrt(7.5), 1e-12);
    expectClose(r.empiricalHalfWidth, 3.85, 1e-12);
    expectClose(r.halfWidth, r.rmseHalfWidth, 0);
    expectClose(r.meanMiss, -0.5, 1e-12);
    expect(r.fewContests).toBe(true);
  });

  it('lets fat tails win: one huge miss among small ones widens the empirical half-width', () => {
    const misses = [...Array.from({ length: 39 }, (_, i) => (i % 2 ? 0.5 : -0.5)), 30];
    const r = historicalAverageInterval(misses);
    expect(r.fewContests).toBe(false);
    expect(r.halfWidth).toBe(Math.max(r.rmseHalfWidth, r.empiricalHalfWidth));
    expect(r.halfWidth).toBeGreaterThan(1);
  });

  it('throws MetricInputError naming pastMisses on degenerate input', () => {
    expectInputError(() => historicalAverageInterval([2]), 'pastMisses');
    expectInputError(() => historicalAverageInterval([2, Number.NaN]), 'pastMisses[1]');
  });
});

describe('tooCloseToCall', () => {
  it('is true when the interval around the average margin reaches a tie', () => {
    const interval = historicalAverageInterval([1, -2, 3, -4]);
    expect(tooCloseToCall(4.2, interval)).toBe(true);
    expect(tooCloseToCall(-6, interval)).toBe(false);
    expect(tooCloseToCall(3, 3)).toBe(true);
    expect(tooCloseToCall(3.0001, 3)).toBe(false);
  });

  it('throws MetricInputError naming the parameter on degenerate input', () => {
    expectInputError(() => tooCloseToCall(Number.NaN, 3), 'averageMargin');
    expectInputError(() => tooCloseToCall(1, -1), 'interval');
    expectInputError(() => tooCloseToCall(1, Number.POSITIVE_INFINITY), 'interval');
  });
});
