import { describe, expect, it } from 'vitest';
import { clusteredMean } from './clustered';
import { deepFreeze, expectInputError } from './testHelpers';

describe('clusteredMean (CR1, t on G − 1 df)', () => {
  it('reproduces the METHODS §6 check case', () => {
    const values = deepFreeze([2.0, 3.1, 1.4, -0.5, 0.4, 1.8, 2.6, 2.2, 1.1, -1.0, 0.3, 0.9]);
    const clusters = deepFreeze(['a', 'a', 'a', 'b', 'b', 'c', 'c', 'c', 'c', 'd', 'd', 'e']);
    const r = clusteredMean(values, clusters);
    // [computed] METHODS §6: statsmodels OLS cov_type="cluster", use_t=True; R sandwich::vcovCL(type="HC1")
    expect(r.mean).toBeCloseTo(1.191667, 6);
    expect(r.se).toBeCloseTo(0.534561, 6);
    expect(r.t as number).toBeCloseTo(2.229244, 6);
    expect(r.p as number).toBeCloseTo(0.089686, 6);
    expect(r.df).toBe(4);
    expect(r.clusters).toBe(5);
    // [computed] reference-data/ranking/reference.json clusteredMean case 0 (statsmodels conf_int)
    expect(r.interval[0]).toBeCloseTo(-0.292513, 6);
    expect(r.interval[1]).toBeCloseTo(2.675846, 6);
  });

  it('with one value per cluster equals the one-sample t interval', () => {
    const r = clusteredMean([1, -1, 2, 0], ['a', 'b', 'c', 'd']);
    // [practice] hand: mean 0.5, s² = (0.25 + 2.25 + 2.25 + 0.25)/3 = 5/3, SE = √(5/12) = 0.645497;
    // t_{0.975,3} = 3.182446 ([computed] scipy.stats.t.ppf(0.975, 3), scipy 1.10.1) → half 2.054260
    expect(r.se).toBeCloseTo(Math.sqrt(5 / 12), 12);
    expect(r.interval[0]).toBeCloseTo(-1.55426, 5);
    expect(r.interval[1]).toBeCloseTo(2.55426, 5);
  });

  it('is wider than the naive interval when errors are shared within clusters', () => {
    const values = [3, 3.2, 2.9, -2, -2.1, -1.8, 0.5, 0.4];
    const clusters = ['a', 'a', 'a', 'b', 'b', 'b', 'c', 'c'];
    const clustered = clusteredMean(values, clusters);
    const naive = clusteredMean(values, values.map((_, i) => i));
    expect(clustered.se).toBeGreaterThan(naive.se);
  });

  it('returns t and p null (not NaN) when all values are equal', () => {
    const r = clusteredMean([2, 2, 2], ['a', 'b', 'b']);
    expect(r.se).toBe(0);
    expect(r.t).toBeNull();
    expect(r.p).toBeNull();
    expect(r.interval).toEqual([2, 2]);
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => clusteredMean([1], ['a']), 'values');
    expectInputError(() => clusteredMean([1, Number.NaN], ['a', 'b']), 'values[1]');
    expectInputError(() => clusteredMean([1, 2], ['a']), 'clusters');
    expectInputError(() => clusteredMean([1, 2], ['a', 'a']), 'clusters');
    expectInputError(() => clusteredMean([1, 2], ['a', 'b'], 1.2), 'level');
  });
});
