/**
 * The two percentile definitions used for bootstrap intervals.
 *
 * - Continuous quantities (excess error, means): LINEAR interpolation between
 *   order statistics, Hyndman & Fan (1996) type 7, position (n − 1)·p (0-based).
 *   This is numpy's default `method='linear'` and R's default `type = 7`; the
 *   arithmetic is simple-statistics 7.12.1 `quantileSorted`.
 * - Ranks: INVERTED empirical CDF, Hyndman & Fan type 1: the smallest draw x
 *   with F̂(x) >= p, i.e. the ⌈n·p⌉-th smallest (1-based), as numpy's
 *   `method='inverted_cdf'` (including its plain floating-point n·p). The endpoints
 *   are then ranks that actually occurred (no interpolated "rank 1.3").
 */
import { quantileSorted } from 'simple-statistics';
import { MetricInputError, requireFinite } from '../errors';
import type { Interval } from './types';
import { requireArray, requireLevel } from './validate';

function sortedCopy(parameter: string, values: readonly number[]): number[] {
  requireArray(parameter, values, 1);
  for (let i = 0; i < values.length; i++) if (!Number.isFinite(values[i])) requireFinite(`${parameter}[${i}]`, values[i]!);
  return [...values].sort((a, b) => a - b);
}

/**
 * Type-7 (linear) percentile of `values` at probability `p`.
 *
 * @param values finite numbers, at least one; not mutated (a sorted copy is used).
 * @param p probability in [0, 1].
 * @throws MetricInputError `values` (empty or non-finite) or `p` (outside [0, 1]).
 * @returns a number between min(values) and max(values).
 * @example
 * percentileLinear([1, 2, 3, 4], 0.5); // → 2.5
 */
export function percentileLinear(values: readonly number[], p: number): number {
  checkP(p);
  return quantileSorted(sortedCopy('values', values), p);
}

/**
 * Type-1 (inverted empirical CDF) percentile of `values` at probability `p`:
 * the ⌈n·p⌉-th smallest value (the smallest when n·p <= 1).
 *
 * @param values finite numbers, at least one; not mutated.
 * @param p probability in [0, 1].
 * @throws MetricInputError `values` (empty or non-finite) or `p` (outside [0, 1]).
 * @returns one of the `values`.
 * @example
 * percentileInvertedCdf([1, 2, 3, 4], 0.5); // → 2
 */
export function percentileInvertedCdf(values: readonly number[], p: number): number {
  checkP(p);
  return invertedCdfSorted(sortedCopy('values', values), p);
}

/**
 * Central percentile interval at `level` (default 0.95): the percentiles at
 * (1 − level)/2 and (1 + level)/2 (rounded to 12 decimals, so 0.95 gives exactly
 * 0.025 and 0.975), by `method` ('linear' = type 7, 'inverted_cdf' = type 1).
 *
 * @throws MetricInputError `values`, `level` (not strictly between 0 and 1).
 * @example
 * percentileInterval([1, 2, 3, 4, 5], 0.5, 'linear'); // → [2, 4]
 */
export function percentileInterval(
  values: readonly number[],
  level = 0.95,
  method: 'linear' | 'inverted_cdf' = 'linear',
): Interval {
  requireLevel('level', level);
  const sorted = sortedCopy('values', values);
  return intervalOfSorted(sorted, level, method);
}

/**
 * `percentileInterval` for an already ascending-sorted, validated, non-empty
 * array (internal fast path for the bootstrap loops).
 */
export function intervalOfSorted(
  sorted: readonly number[],
  level: number,
  method: 'linear' | 'inverted_cdf',
): Interval {
  // (1 − 0.95)/2 is 0.025000000000000022 in binary floating point, which would
  // push ⌈n·p⌉ one order statistic up when n·0.025 is an integer; the tail
  // probabilities are therefore rounded to 12 decimals first.
  const lowP = Math.round(((1 - level) / 2) * 1e12) / 1e12;
  const highP = Math.round(((1 + level) / 2) * 1e12) / 1e12;
  if (method === 'linear') {
    return [quantileSorted(sorted, lowP), quantileSorted(sorted, highP)];
  }
  return [invertedCdfSorted(sorted, lowP), invertedCdfSorted(sorted, highP)];
}

function invertedCdfSorted(sorted: readonly number[], p: number): number {
  // numpy 'inverted_cdf': 1-based order statistic ⌈n·p⌉, clamped to [1, n].
  const k = Math.min(sorted.length, Math.max(1, Math.ceil(sorted.length * p)));
  return sorted[k - 1] as number;
}

function checkP(p: number): void {
  requireFinite('p', p);
  if (p < 0 || p > 1) throw new MetricInputError('p', 'must be between 0 and 1');
}
