/**
 * Intraclass correlation ICC(1) of errors grouped by contest, by one-way ANOVA moments.
 *
 * It measures how much of the variance of poll errors is shared by the polls of one contest:
 * 0 means polls of a contest agree no more than polls of different contests, 1 means every
 * poll of a contest has the same error.
 */
import { requireSample, MetricInputError } from '../errors';
import { fUpperP } from '../distributions';
import { allEqual, meanOf, sumSquaredDeviations } from './internal';

/** Result of {@link icc1}. Variances are in the squared units of the input (points²). */
export interface Icc1Result {
  /** Which estimator produced the variance components: ANOVA method of moments (not REML). */
  readonly estimator: 'anova-moments';
  /** Number of groups J. */
  readonly groups: number;
  /** Number of values N. */
  readonly n: number;
  /** Average group size adjusted for imbalance: n₀ = [N − Σn_c²/N]/(J − 1). */
  readonly n0: number;
  /** Between-group sum of squares Σ n_c (ȳ_c − ȳ)². */
  readonly ssBetween: number;
  /** Within-group sum of squares Σ_c Σ_j (y_cj − ȳ_c)². */
  readonly ssWithin: number;
  /** Between-group degrees of freedom J − 1. */
  readonly dfBetween: number;
  /** Within-group degrees of freedom N − J. */
  readonly dfWithin: number;
  /** Mean square between, SSB/(J − 1). */
  readonly msb: number;
  /** Mean square within, SSW/(N − J) (> 0). */
  readonly msw: number;
  /** F = MSB/MSW. */
  readonly f: number;
  /** Upper-tail p-value of F on (J − 1, N − J) df: the test of no between-group variance. */
  readonly p: number;
  /** Between-group variance σ_b² = (MSB − MSW)/n₀; negative when MSB < MSW (not truncated). */
  readonly sigma2Between: number;
  /** ICC(1) = σ_b²/(σ_b² + MSW), in (−1/(n₀ − 1), 1); negative values are reported as they are. */
  readonly icc: number;
}

/**
 * ICC(1) by one-way random-effects ANOVA, method of moments.
 *
 * Formulas (METHODS §6): MSB = SSB/(J−1), MSW = SSW/(N−J), n₀ = [N − Σn_c²/N]/(J − 1),
 * σ_b² = (MSB − MSW)/n₀, ICC = σ_b²/(σ_b² + MSW), F = MSB/MSW on (J−1, N−J) df.
 * On unbalanced data the moment estimate differs from REML; Veracast uses moments.
 * Groups of one value count in N and J and add nothing to SSW.
 *
 * @param groups values per group (errors per contest, points); at least 2 groups, each with
 *   at least 1 finite value, and at least one group with 2 or more values.
 * @throws MetricInputError naming `groups` (fewer than 2 groups, no group with 2 values,
 *   all values equal, or zero within-group variance) or `groups[i]` (empty or not finite).
 * @returns the ANOVA table, σ_b² (may be negative) and ICC (may be negative).
 * @example
 * icc1([[3.1, 2.4, 4.0], [-1.2, -0.3, -2.0], [0.5, 1.5, 0.2], [2.2, 1.0, 2.9]])
 * // → msb 10.380833, msw 0.688333, f 15.081114, dfBetween 3, dfWithin 8, p 0.001176,
 * //   icc 0.824367
 */
export function icc1(groups: readonly (readonly number[])[]): Icc1Result {
  if (!Array.isArray(groups) || groups.length < 2) {
    throw new MetricInputError('groups', 'must hold at least 2 groups');
  }
  groups.forEach((g, i) => requireSample(`groups[${i}]`, g, 1));
  const all = groups.flat();
  const n = all.length;
  const j = groups.length;
  if (n - j < 1) throw new MetricInputError('groups', 'must include a group with at least 2 values');
  if (allEqual(all)) throw new MetricInputError('groups', 'has zero variance');

  const grand = meanOf(all);
  let ssBetween = 0;
  let ssWithin = 0;
  let sumSquaredSizes = 0;
  for (const g of groups) {
    const d = meanOf(g) - grand;
    ssBetween += g.length * d * d;
    ssWithin += sumSquaredDeviations(g);
    sumSquaredSizes += g.length * g.length;
  }
  const dfBetween = j - 1;
  const dfWithin = n - j;
  const msb = ssBetween / dfBetween;
  const msw = ssWithin / dfWithin;
  if (!(msw > 0)) throw new MetricInputError('groups', 'has zero within-group variance');
  const n0 = (n - sumSquaredSizes / n) / dfBetween;
  const sigma2Between = (msb - msw) / n0;
  const f = msb / msw;
  return {
    estimator: 'anova-moments',
    groups: j,
    n,
    n0,
    ssBetween,
    ssWithin,
    dfBetween,
    dfWithin,
    msb,
    msw,
    f,
    p: fUpperP(f, dfBetween, dfWithin),
    sigma2Between,
    icc: sigma2Between / (sigma2Between + msw),
  };
}
