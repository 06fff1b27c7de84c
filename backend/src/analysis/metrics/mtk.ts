/**
 * Predictive accuracy A of Martin, Traugott & Kennedy (2005), *Public Opinion
 * Quarterly* 69:342–369 (METHODS §3), its delta-method standard error and the
 * mean of A over many polls.
 */
import { mean, sampleStandardDeviation } from 'simple-statistics';
import { MetricInputError, requirePositive, requireSample } from '../errors';
import { Z95, normalTwoSidedP, studentTQuantile, tTwoSidedP } from '../distributions';
import { requirePoints } from './shares';

/** Inputs of {@link mtkAccuracy}: shares in points and the (effective) sample size. */
export interface MtkInput {
  /** Poll share of A on the published base, points in (0, 100]. */
  readonly pollA: number;
  /** Poll share of B on the published base, points in (0, 100]. */
  readonly pollB: number;
  /** Certified share of A, points in (0, 100]. */
  readonly resultA: number;
  /** Certified share of B, points in (0, 100]. */
  readonly resultB: number;
  /** Sample size, or n_eff = n/deff with a design effect; > 0, need not be an integer. */
  readonly n: number;
}

/** A with its normal-theory test and 95% interval. */
export interface MtkResult {
  /** A = ln[(p_A/p_B)/(V_A/V_B)], a log odds ratio; 0 is perfect, > 0 leans to A. */
  a: number;
  /** √[1/(n·p_A) + 1/(n·p_B)], p in proportions of the published base. */
  se: number;
  /** A/SE. */
  z: number;
  /** Two-sided normal p-value of z, in [0, 1]. */
  p: number;
  /** A − z₀.₉₇₅·SE. */
  lower: number;
  /** A + z₀.₉₇₅·SE. */
  upper: number;
}

function requireOpenPoints(parameter: string, x: number): void {
  requirePoints(parameter, x);
  if (x <= 0) throw new MetricInputError(parameter, 'must be greater than 0 points');
}

/**
 * Martin–Traugott–Kennedy predictive accuracy for one poll.
 *
 * A = ln[(p_A/p_B)/(V_A/V_B)] = logit(q) − logit(Q), q and Q the two-party
 * shares of A. A depends on shares only through the ratios p_A/p_B and
 * V_A/V_B, so it is the same under every undecided treatment and any scaling
 * of the poll's shares. Var(A) ≈ 1/(n·p_A) + 1/(n·p_B) by the delta method with
 * the result taken as fixed; n·p_A counts A's respondents, so pass shares on
 * the published base (raw), not shares rescaled over decided respondents.
 * z = A/SE with a two-sided normal p-value; 95% interval A ± 1.959964·SE.
 *
 * @param input - see {@link MtkInput}; all shares > 0, n > 0.
 * @throws {MetricInputError} `pollA`, `pollB`, `resultA`, `resultB` (not in (0, 100]) or `n` (not > 0).
 * @returns {@link MtkResult}.
 * @example mtkAccuracy({ pollA: 40, pollB: 52, resultA: 47, resultB: 49, n: 800 })
 * // => { a: -0.220692…, se: 0.074356…, z: -2.968031…, p: 0.002997…, … }
 */
export function mtkAccuracy(input: MtkInput): MtkResult {
  if (input === null || typeof input !== 'object') throw new MetricInputError('input', 'must be an object');
  const { pollA, pollB, resultA, resultB, n } = input;
  requireOpenPoints('pollA', pollA);
  requireOpenPoints('pollB', pollB);
  requireOpenPoints('resultA', resultA);
  requireOpenPoints('resultB', resultB);
  requirePositive('n', n);
  const a = Math.log(pollA / pollB) - Math.log(resultA / resultB);
  const se = Math.sqrt(1 / ((n * pollA) / 100) + 1 / ((n * pollB) / 100));
  const z = a / se;
  return { a, se, z, p: normalTwoSidedP(z), lower: a - Z95 * se, upper: a + Z95 * se };
}

/** Mean of A over k polls with its t test. */
export interface MtkMean {
  k: number;
  /** Arithmetic mean of the A values. */
  mean: number;
  /** Sample standard deviation (n − 1 denominator, simple-statistics `sampleStandardDeviation`). */
  sd: number;
  /** sd/√k. */
  se: number;
  /** mean/se, Student t on k − 1 df against mean 0. */
  t: number;
  df: number;
  /** Two-sided p-value, in [0, 1]. */
  p: number;
  /** mean ∓ t₀.₉₇₅,k−1·se. */
  lower: number;
  upper: number;
}

/**
 * Mean of MTK's A across polls, its standard error s/√k and a one-sample
 * t test of mean 0 on k − 1 degrees of freedom (METHODS §3). Treats the polls
 * as independent: polls of one contest share error (METHODS §6), so use one
 * poll per contest or a clustered error for inference across contests.
 *
 * @param values - A values, at least 2, finite, not all equal.
 * @throws {MetricInputError} `values` (fewer than 2, or all equal so that t is
 *   undefined) or `values[i]` (not finite).
 * @returns {@link MtkMean}.
 * @example mtkMean([0.05, -0.02, 0.11, 0.07, 0.03]) // => { mean: 0.048, se: 0.021541…, t: 2.228344…, df: 4, p: 0.089776…, … }
 */
export function mtkMean(values: readonly number[]): MtkMean {
  requireSample('values', values, 2);
  const k = values.length;
  const m = mean(values);
  // Test equality on the values: the mean of equal floats can carry rounding
  // (3 × 0.1 / 3 ≠ 0.1), which would leave a spurious sd of order 1e-17.
  const sd = sampleStandardDeviation(values);
  if (values.every((v) => v === values[0]) || !(sd > 0)) {
    throw new MetricInputError('values', 'must not all be equal (a standard deviation of 0 leaves t undefined)');
  }
  const se = sd / Math.sqrt(k);
  const df = k - 1;
  const t = m / se;
  const crit = studentTQuantile(0.975, df);
  return { k, mean: m, sd, se, t, df, p: tTwoSidedP(t, df), lower: m - crit * se, upper: m + crit * se };
}
