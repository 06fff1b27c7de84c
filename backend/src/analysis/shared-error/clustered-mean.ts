/**
 * Mean signed error with a cluster-robust (CR1) standard error, contests as clusters.
 *
 * Polls of one contest share that contest's error, so they are not independent
 * observations: an ordinary s/√N standard error of the mean is too small. The CR1
 * sandwich variance of an intercept-only regression treats each contest as one unit.
 */
import { sum } from 'simple-statistics';
import { MetricInputError, requireSample } from '../errors';
import { studentTQuantile, tTwoSidedP } from '../distributions';
import { groupBy, meanOf, requireKey, requireSameLength, requireSpread } from './internal';

/** Result of {@link clusteredMean}. Units are those of `values` (points for errors). */
export interface ClusteredMeanResult {
  /** Number of values N. */
  readonly n: number;
  /** Number of distinct clusters G. */
  readonly clusters: number;
  /** Arithmetic mean ȳ. */
  readonly mean: number;
  /** CR1 cluster-robust standard error of ȳ (> 0). */
  readonly se: number;
  /** Degrees of freedom of the t reference: G − 1. */
  readonly df: number;
  /** t = ȳ / SE. */
  readonly t: number;
  /** Two-sided p-value of t on G − 1 df (Student t reference, not normal), in (0, 1]. */
  readonly p: number;
  /** Lower end of the 95% interval ȳ − t₀.₉₇₅,G−1 · SE. */
  readonly ciLow: number;
  /** Upper end of the 95% interval ȳ + t₀.₉₇₅,G−1 · SE. */
  readonly ciHigh: number;
}

/**
 * Mean with a CR1 cluster-robust standard error and a t test of mean = 0.
 *
 * Formula (Cameron & Miller 2015, *J. Human Resources* 50:317–372), K = 1 regressor:
 *   u_j = y_j − ȳ,  V = [G/(G−1)] · [(N−1)/(N−K)] · Σ_g (Σ_{j∈g} u_j)² / N²,
 * so with K = 1 the second factor is 1. SE = √V, t = ȳ/SE on G − 1 degrees of freedom,
 * 95% interval ȳ ± t₀.₉₇₅,G−1·SE. This matches statsmodels
 * `OLS(y, ones).fit(cov_type="cluster", use_t=True)` and R `sandwich::vcovCL(type="HC1")`;
 * statsmodels' default (use_t=False) uses a normal reference, which overstates significance
 * with few clusters, and is deliberately not used.
 *
 * @param values finite numbers (e.g. signed margin errors in points), at least 2.
 * @param clusters cluster key of each value (e.g. contest key), same length, non-empty strings;
 *   at least 2 distinct keys.
 * @throws MetricInputError naming `values` (fewer than 2, not finite, all equal, or zero
 *   cluster-robust variance) or `clusters` (length mismatch, empty key, fewer than 2 clusters).
 * @returns mean, SE > 0, df = G − 1, t, two-sided p in (0, 1], 95% interval.
 * @example
 * clusteredMean([2.0, 3.1, 1.4, -0.5, 0.4, 1.8, 2.6, 2.2, 1.1, -1.0, 0.3, 0.9],
 *   ['a','a','a','b','b','c','c','c','c','d','d','e'])
 * // → mean 1.191667, se 0.534561, df 4, t 2.229244, p 0.089686
 */
export function clusteredMean(
  values: readonly number[],
  clusters: readonly string[],
): ClusteredMeanResult {
  requireSample('values', values, 2);
  requireSameLength('clusters', clusters, 'values', values);
  for (let i = 0; i < clusters.length; i++) if (!(typeof clusters[i] === 'string' && clusters[i]!.length > 0)) requireKey(`clusters[${i}]`, clusters[i]);
  requireSpread('values', values);

  const n = values.length;
  const m = meanOf(values);
  const byCluster = groupBy(
    values.map((y, i) => ({ u: y - m, cluster: clusters[i] as string })),
    (r) => r.cluster,
  );
  const g = byCluster.size;
  if (g < 2) throw new MetricInputError('clusters', 'must name at least 2 distinct clusters');

  const squaredScores = [...byCluster.values()].map((rows) => {
    const s = sum(rows.map((r) => r.u));
    return s * s;
  });
  const variance = (g / (g - 1)) * (sum(squaredScores) / (n * n));
  const se = Math.sqrt(variance);
  // Cluster sums that cancel exactly can leave rounding dust; treat an SE below 1e-12 of the
  // largest residual as zero rather than report an astronomically large t.
  const scale = Math.max(...values.map((y) => Math.abs(y - m)));
  if (!(se > 1e-12 * scale)) {
    throw new MetricInputError('values', 'has zero cluster-robust variance (every cluster sums to the mean)');
  }
  const df = g - 1;
  const t = m / se;
  const half = studentTQuantile(0.975, df) * se;
  return { n, clusters: g, mean: m, se, df, t, p: tTwoSidedP(t, df), ciLow: m - half, ciHigh: m + half };
}
