import { describe, expect, it } from 'vitest';
import { normalTwoSidedP } from '../distributions';
import { clusteredMean } from './clustered-mean';
import { deepFreeze, expectClose, expectInputError } from './testing';

// METHODS §6 "Mean error = 0 with clustered polls": contests {2.0, 3.1, 1.4}, {−0.5, 0.4},
// {1.8, 2.6, 2.2, 1.1}, {−1.0, 0.3}, {0.9}.
const values = deepFreeze([2.0, 3.1, 1.4, -0.5, 0.4, 1.8, 2.6, 2.2, 1.1, -1.0, 0.3, 0.9]);
const clusters = deepFreeze(['a', 'a', 'a', 'b', 'b', 'c', 'c', 'c', 'c', 'd', 'd', 'e']);

describe('clusteredMean', () => {
  it('reproduces the METHODS §6 check values', () => {
    const r = clusteredMean(values, clusters);
    // [computed] METHODS §6: statsmodels 0.13.5 OLS(y, ones).fit(cov_type="cluster", use_t=True);
    // R sandwich::vcovCL(type="HC1") agrees.
    expectClose(r.mean, 1.191667);
    expectClose(r.se, 0.534561);
    expectClose(r.t, 2.229244);
    expectClose(r.p, 0.089686);
    expect(r.df).toBe(4);
    expect(r.clusters).toBe(5);
    expect(r.n).toBe(12);
  });

  it('uses the t reference on G − 1 df, not the normal one', () => {
    const r = clusteredMean(values, clusters);
    // [computed] METHODS §6: statsmodels' default normal reference gives p 0.025798.
    expectClose(normalTwoSidedP(r.t), 0.025798);
    expect(Math.abs(r.p - 0.025798)).toBeGreaterThan(0.05);
  });

  it('gives a 95% interval that is symmetric and excludes 0 exactly when p < 0.05', () => {
    const r = clusteredMean(values, clusters);
    expectClose((r.ciLow + r.ciHigh) / 2, r.mean, 1e-12);
    expect(r.ciLow < 0 && r.ciHigh > 0).toBe(r.p >= 0.05);
  });

  it('does not depend on the order of the rows or the cluster labels', () => {
    const r = clusteredMean(values, clusters);
    const order = [11, 3, 7, 0, 9, 5, 1, 10, 2, 6, 4, 8];
    const r2 = clusteredMean(
      order.map((i) => values[i] as number),
      order.map((i) => `x-${clusters[i] as string}`),
    );
    expectClose(r2.se, r.se, 1e-12);
    expectClose(r2.p, r.p, 1e-12);
  });

  it('moves the mean but not the SE under a shift, and scales the SE under scaling', () => {
    const r = clusteredMean(values, clusters);
    const shifted = clusteredMean(values.map((v) => v + 3), clusters);
    const scaled = clusteredMean(values.map((v) => v * -2), clusters);
    expectClose(shifted.mean, r.mean + 3, 1e-12);
    expectClose(shifted.se, r.se, 1e-12);
    expectClose(scaled.se, 2 * r.se, 1e-12);
    expectClose(scaled.t, -r.t, 1e-12);
  });

  it('equals the ordinary s/√N when each value is its own cluster', () => {
    // With singleton clusters CR1 = [N/(N−1)]·Σu²/N² = s²/N exactly (s² with N − 1).
    const xs = [1.5, -0.2, 2.8, 0.9, 3.3];
    const r = clusteredMean(xs, ['1', '2', '3', '4', '5']);
    const m = xs.reduce((a, b) => a + b, 0) / xs.length;
    const s2 = xs.reduce((a, b) => a + (b - m) ** 2, 0) / (xs.length - 1);
    expectClose(r.se, Math.sqrt(s2 / xs.length), 1e-12);
  });

  it('throws MetricInputError naming the parameter on degenerate input', () => {
    expectInputError(() => clusteredMean([1], ['a']), 'values');
    expectInputError(() => clusteredMean([1, Number.NaN], ['a', 'b']), 'values[1]');
    expectInputError(() => clusteredMean([1, 2, 3], ['a', 'b']), 'clusters');
    expectInputError(() => clusteredMean([1, 2], ['a', '']), 'clusters[1]');
    expectInputError(() => clusteredMean([1, 2, 3], ['a', 'a', 'a']), 'clusters');
    expectInputError(() => clusteredMean([2, 2, 2], ['a', 'b', 'c']), 'values');
    // every cluster's residuals sum to zero: cluster means both equal the grand mean
    expectInputError(() => clusteredMean([1, 3, 0, 4], ['a', 'a', 'b', 'b']), 'values');
  });
});
