/**
 * Mean with a CR1 cluster-robust standard error (METHODS §6).
 */
import { sum } from 'simple-statistics';
import { studentTQuantile, tTwoSidedP } from '../distributions';
import { MetricInputError, requireFinite } from '../errors';
import type { Interval } from './types';
import { requireArray, requireLevel } from './validate';

export interface ClusteredMean {
  /** Number of values N. */
  readonly n: number;
  /** Number of distinct clusters G (>= 2). */
  readonly clusters: number;
  /** Plain mean ȳ of all N values. */
  readonly mean: number;
  /** CR1 cluster-robust standard error of ȳ. */
  readonly se: number;
  /** Degrees of freedom of the t reference: G − 1. */
  readonly df: number;
  /** t = ȳ / SE for the test of mean 0; null when SE = 0 (all values equal). */
  readonly t: number | null;
  /** Two-sided p-value on G − 1 df; null when SE = 0. */
  readonly p: number | null;
  /** ȳ ± t_{(1+level)/2, G−1}·SE. */
  readonly interval: Interval;
}

/**
 * Mean of values grouped in clusters, with the CR1 cluster-robust variance
 * (Cameron & Miller 2015, *J. Human Resources* 50:317–372 [memory]):
 *
 *   V = [G/(G − 1)]·[(N − 1)/(N − K)]·Σ_g (Σ_{j∈g} u_j)² / N²,  u_j = y_j − ȳ,  K = 1,
 *
 * so the middle factor is 1 for a mean. The reference distribution is Student t
 * on G − 1 df (statsmodels OLS `cov_type="cluster", use_t=True`; R
 * `sandwich::vcovCL(type = "HC1")`), NOT the normal. With one value per cluster
 * this is the ordinary one-sample t interval (V = s²/N).
 *
 * @param values finite values y_j (points), at least 2.
 * @param clusters cluster label of each value (e.g. its contest key), same length;
 *   at least 2 distinct labels.
 * @param level confidence level, default 0.95.
 * @throws MetricInputError `values`, `clusters` (length differs, or fewer than 2 distinct), `level`.
 * @returns mean, SE, df, t, p, interval.
 * @example
 * clusteredMean([2.0, 3.1, 1.4, -0.5, 0.4, 1.8, 2.6, 2.2, 1.1, -1.0, 0.3, 0.9],
 *   ['a', 'a', 'a', 'b', 'b', 'c', 'c', 'c', 'c', 'd', 'd', 'e']);
 * // → { mean: 1.191667…, se: 0.534561…, t: 2.229244…, p: 0.089686…, df: 4, … } (METHODS §6)
 */
export function clusteredMean(
  values: readonly number[],
  clusters: readonly (string | number)[],
  level = 0.95,
): ClusteredMean {
  requireArray('values', values, 2);
  for (let i = 0; i < values.length; i++) if (!Number.isFinite(values[i])) requireFinite(`values[${i}]`, values[i]!);
  requireArray('clusters', clusters, 0);
  if (clusters.length !== values.length) {
    throw new MetricInputError('clusters', 'must have the same length as values');
  }
  requireLevel('level', level);
  const n = values.length;
  const ybar = sum(values) / n;
  const scores = new Map<string | number, number[]>();
  values.forEach((y, i) => {
    const g = clusters[i] as string | number;
    const list = scores.get(g);
    if (list) list.push(y - ybar);
    else scores.set(g, [y - ybar]);
  });
  const G = scores.size;
  if (G < 2) throw new MetricInputError('clusters', 'must name at least 2 distinct clusters');
  const K = 1;
  const meat = sum([...scores.values()].map((u) => sum(u) ** 2));
  const variance = (G / (G - 1)) * ((n - 1) / (n - K)) * (meat / (n * n));
  const se = Math.sqrt(variance);
  const df = G - 1;
  const half = studentTQuantile((1 + level) / 2, df) * se;
  const t = se > 0 ? ybar / se : null;
  return {
    n,
    clusters: G,
    mean: ybar,
    se,
    df,
    t,
    p: t === null ? null : tTwoSidedP(t, df),
    interval: [ybar - half, ybar + half],
  };
}
