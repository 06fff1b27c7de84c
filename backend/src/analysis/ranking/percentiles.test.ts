import { describe, expect, it } from 'vitest';
import { percentileInterval, percentileInvertedCdf, percentileLinear } from './percentiles';
import { deepFreeze, expectInputError } from './testHelpers';

describe('percentiles', () => {
  it('linear (type 7) interpolates at position (n − 1)p', () => {
    // [practice] hand: (4 − 1)·0.5 = 1.5 → halfway between 2 and 3
    expect(percentileLinear([4, 1, 3, 2], 0.5)).toBe(2.5);
    // [practice] hand: (5 − 1)·0.25 = 1 → second smallest = 2; 0.75 → 4
    expect(percentileInterval([5, 4, 3, 2, 1], 0.5, 'linear')).toEqual([2, 4]);
  });

  it('inverted CDF (type 1) returns the ⌈np⌉-th smallest value', () => {
    // [practice] hand: n = 4, p = 0.5 → ⌈2⌉ = 2nd smallest = 2
    expect(percentileInvertedCdf([4, 1, 3, 2], 0.5)).toBe(2);
    // [practice] hand: n = 4, p = 0.51 → ⌈2.04⌉ = 3rd smallest = 3
    expect(percentileInvertedCdf([4, 1, 3, 2], 0.51)).toBe(3);
    // [practice] hand: n = 40 values 1..40, p 0.025 → 1st, p 0.975 → 39th
    const xs = Array.from({ length: 40 }, (_, i) => 40 - i);
    expect(percentileInterval(xs, 0.95, 'inverted_cdf')).toEqual([1, 39]);
    // [practice] p = 0 → minimum, p = 1 → maximum
    expect(percentileInvertedCdf(xs, 0)).toBe(1);
    expect(percentileInvertedCdf(xs, 1)).toBe(40);
  });

  it('does not mutate its input', () => {
    const xs = deepFreeze([3, 1, 2]);
    expect(percentileLinear(xs, 0)).toBe(1);
    expect(percentileInterval(xs)).toHaveLength(2);
    expect(xs).toEqual([3, 1, 2]);
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => percentileLinear([], 0.5), 'values');
    expectInputError(() => percentileLinear([1, Number.NaN], 0.5), 'values[1]');
    expectInputError(() => percentileLinear([1], 1.5), 'p');
    expectInputError(() => percentileInvertedCdf([1], -0.1), 'p');
    expectInputError(() => percentileInterval([1, 2], 1), 'level');
    expectInputError(() => percentileInterval([1, 2], 0), 'level');
  });
});
