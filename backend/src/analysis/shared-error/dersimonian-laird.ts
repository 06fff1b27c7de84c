/**
 * DerSimonian–Laird random-effects pooling: how much the polls of one contest disagree
 * beyond what their sampling variances allow (the excess variance τ²).
 */
import { sum } from 'simple-statistics';
import { MetricInputError, requirePositive, requireSample } from '../errors';
import { chiSquareUpperP } from '../distributions';
import { requireSameLength } from './internal';

/** Result of {@link derSimonianLaird}. Units: those of `y` (points) and `v` (points²). */
export interface DerSimonianLairdResult {
  /** Number of estimates k. */
  readonly k: number;
  /** Cochran's Q = Σ w (y − μ_FE)², w = 1/v. */
  readonly q: number;
  /** Degrees of freedom of Q: k − 1. */
  readonly df: number;
  /** Upper-tail χ² p-value of Q on k − 1 df (test of no excess variance). */
  readonly qP: number;
  /** C = Σw − Σw²/Σw. */
  readonly c: number;
  /** Excess (between-estimate) variance τ² = max(0, (Q − (k − 1))/C) ≥ 0. */
  readonly tau2: number;
  /** Fixed-effect (inverse-variance) mean μ_FE = Σ w y / Σ w. */
  readonly muFE: number;
  /** Standard error of μ_FE: 1/√Σw. */
  readonly seFE: number;
  /** Random-effects mean with weights 1/(v + τ²). */
  readonly muRE: number;
  /** Standard error of μ_RE: 1/√Σ 1/(v + τ²). */
  readonly seRE: number;
  /** I² = max(0, (Q − (k − 1))/Q), in [0, 1); 0 when Q ≤ k − 1 (including Q = 0). */
  readonly i2: number;
}

/**
 * DerSimonian & Laird (1986, *Controlled Clinical Trials* 7:177–188) method-of-moments
 * random-effects estimate.
 *
 * w = 1/v, μ_FE = Σwy/Σw, Q = Σw(y − μ_FE)², C = Σw − Σw²/Σw,
 * τ² = max(0, (Q − (k−1))/C), w* = 1/(v + τ²), μ_RE = Σw*y/Σw*, SE_RE = 1/√Σw*,
 * I² = max(0, (Q − (k−1))/Q). Matches statsmodels `combine_effects(y, v, method_re="dl")`.
 *
 * @param y estimates (poll errors of one contest, points), at least 2, finite.
 * @param v their sampling variances (points²), same length, each > 0.
 * @throws MetricInputError naming `y` (fewer than 2, not finite) or `v` (length, not > 0).
 * @returns Q with its p, τ² ≥ 0, fixed and random-effects means with SEs, I² in [0, 1).
 * @example
 * derSimonianLaird([2.1, -0.5, 3.4, 1.2, 0.8], [1.0, 1.5, 0.8, 2.0, 1.2])
 * // → q 7.798366, qP 0.099250, tau2 1.143996, muRE 1.550735, seRE 0.689454,
 * //   muFE 1.713725, seFE 0.485071, i2 0.487072
 */
export function derSimonianLaird(y: readonly number[], v: readonly number[]): DerSimonianLairdResult {
  requireSample('y', y, 2);
  requireSameLength('v', v, 'y', y);
  for (let i = 0; i < v.length; i++) if (!(Number.isFinite(v[i]) && v[i]! > 0)) requirePositive(`v[${i}]`, v[i]!);

  const k = y.length;
  const w = v.map((x) => 1 / x);
  const sw = sum(w);
  const muFE = sum(y.map((yi, i) => (w[i] as number) * yi)) / sw;
  const q = sum(y.map((yi, i) => (w[i] as number) * (yi - muFE) * (yi - muFE)));
  const c = sw - sum(w.map((wi) => wi * wi)) / sw;
  if (!(c > 0)) throw new MetricInputError('v', 'must give a positive C = Σw − Σw²/Σw');
  const df = k - 1;
  const tau2 = Math.max(0, (q - df) / c);
  const wStar = v.map((x) => 1 / (x + tau2));
  const swStar = sum(wStar);
  const muRE = sum(y.map((yi, i) => (wStar[i] as number) * yi)) / swStar;
  return {
    k,
    q,
    df,
    qP: chiSquareUpperP(q, df),
    c,
    tau2,
    muFE,
    seFE: 1 / Math.sqrt(sw),
    muRE,
    seRE: 1 / Math.sqrt(swStar),
    i2: q > df ? (q - df) / q : 0,
  };
}
