/**
 * Pearson and Spearman correlation with their tests, for two firms' errors over the contests
 * both polled.
 */
import { sampleCorrelation, sampleRankCorrelation } from 'simple-statistics';
import { requireSample } from '../errors';
import { Z95, tTwoSidedP } from '../distributions';
import { requireSameLength, requireSpread } from './internal';

/** Result of {@link pearson}. */
export interface PearsonResult {
  /** Number of pairs n. */
  readonly n: number;
  /** Pearson's r in [−1, 1]. */
  readonly r: number;
  /** t = r√((n − 2)/(1 − r²)); null when |r| = 1 (the statistic is infinite). */
  readonly t: number | null;
  /** Degrees of freedom n − 2. */
  readonly df: number;
  /** Two-sided p-value of t on n − 2 df, in [0, 1]; 0 when |r| = 1. */
  readonly p: number;
  /** Lower end of the Fisher-z 95% interval; null when n = 3 (needs n > 3). */
  readonly ciLow: number | null;
  /** Upper end of the Fisher-z 95% interval; null when n = 3. */
  readonly ciHigh: number | null;
}

/** Result of {@link spearman}. */
export interface SpearmanResult {
  /** Number of pairs n. */
  readonly n: number;
  /** Spearman's ρ_s: Pearson's r of the average ranks, in [−1, 1]. */
  readonly rho: number;
  /** t = ρ_s√((n − 2)/(1 − ρ_s²)); null when |ρ_s| = 1. */
  readonly t: number | null;
  /** Degrees of freedom n − 2. */
  readonly df: number;
  /** Approximate two-sided p from the t distribution on n − 2 df (not the exact permutation p). */
  readonly p: number;
}

function validatePair(x: readonly number[], y: readonly number[]): void {
  requireSample('x', x, 3);
  requireSameLength('y', y, 'x', x);
  requireSample('y', y, 3);
  requireSpread('x', x);
  requireSpread('y', y);
}

function tOf(r: number, n: number): { t: number | null; p: number } {
  if (Math.abs(r) >= 1) return { t: null, p: 0 };
  const t = r * Math.sqrt((n - 2) / (1 - r * r));
  return { t, p: tTwoSidedP(t, n - 2) };
}

/**
 * Keeps r in [−1, 1] and reports values within 1e-13 of ±1 as exactly ±1: they are rounding of
 * a perfect (rank) correlation, whose t statistic is infinite.
 */
const clampUnit = (r: number): number => {
  if (r >= 1 - 1e-13) return 1;
  if (r <= -1 + 1e-13) return -1;
  return r;
};

/**
 * Pearson's product-moment correlation with a t test and a Fisher-z 95% interval.
 *
 * r = cov(x, y)/(s_x s_y) (simple-statistics `sampleCorrelation`; the n − 1 denominators
 * cancel), t = r√((n−2)/(1−r²)) on n − 2 df, two-sided p (equal to scipy's exact p for
 * `pearsonr`), interval tanh(atanh r ± z₀.₉₇₅/√(n − 3)).
 *
 * @param x finite values, at least 3, not all equal.
 * @param y finite values, same length, not all equal.
 * @throws MetricInputError naming `x` or `y` (too few, length mismatch, not finite, zero variance).
 * @returns r in [−1, 1], t (null if |r| = 1), df, p in [0, 1], Fisher-z interval (null if n = 3).
 * @example
 * pearson([1.2, -0.5, 2.3, 0.8, -1.1, 3.0, 0.4, 1.9], [0.9, 0.1, 1.8, 1.2, -0.6, 2.2, -0.3, 1.0])
 * // → r 0.920415, p 0.001186, ciLow 0.613934, ciHigh 0.985743
 */
export function pearson(x: readonly number[], y: readonly number[]): PearsonResult {
  validatePair(x, y);
  const n = x.length;
  const r = clampUnit(sampleCorrelation(x, y));
  const { t, p } = tOf(r, n);
  let ciLow: number | null = null;
  let ciHigh: number | null = null;
  if (n > 3) {
    if (Math.abs(r) >= 1) {
      ciLow = r;
      ciHigh = r;
    } else {
      const z = Math.atanh(r);
      const half = Z95 / Math.sqrt(n - 3);
      ciLow = Math.tanh(z - half);
      ciHigh = Math.tanh(z + half);
    }
  }
  return { n, r, t, df: n - 2, p, ciLow, ciHigh };
}

/**
 * Spearman's rank correlation with the t-approximation p-value.
 *
 * Ties get average ranks (simple-statistics `sampleRankCorrelation`); ρ_s is Pearson's r of
 * the ranks; p comes from t = ρ_s√((n−2)/(1−ρ_s²)) on n − 2 df. This is the approximate p that
 * `scipy.stats.spearmanr` reports, not an exact permutation p (which differs for small n).
 *
 * @param x finite values, at least 3, not all equal.
 * @param y finite values, same length, not all equal.
 * @throws MetricInputError naming `x` or `y` (too few, length mismatch, not finite, zero variance).
 * @returns ρ_s in [−1, 1], t (null if |ρ_s| = 1), df, approximate p in [0, 1].
 * @example
 * spearman([1.2, -0.5, 2.3, 0.8, -1.1, 3.0, 0.4, 1.9], [0.9, 0.1, 1.8, 1.2, -0.6, 2.2, -0.3, 1.0])
 * // → rho 0.904762, p 0.002008
 */
export function spearman(x: readonly number[], y: readonly number[]): SpearmanResult {
  validatePair(x, y);
  const n = x.length;
  const rho = clampUnit(sampleRankCorrelation(x, y));
  const { t, p } = tOf(rho, n);
  return { n, rho, t, df: n - 2, p };
}
