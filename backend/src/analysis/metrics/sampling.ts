/**
 * Sampling error, design effect and intervals (METHODS §5).
 *
 * Units: every share here is a **proportion** in [0, 1] and every MOE or SE a
 * proportion too, except {@link nEffFromStatedMoe}, whose argument is the
 * stated MOE in points as firms publish it. Multiply by 100 for points.
 * z = Φ⁻¹(0.975) = 1.959964 (`Z95`, from @stdlib).
 */
import { sum } from 'simple-statistics';
import { MetricInputError, requireFinite, requirePositive, requireSample } from '../errors';
import { Z95 } from '../distributions';

function requireProportion(parameter: string, p: number): void {
  requireFinite(parameter, p);
  if (p < 0 || p > 1) throw new MetricInputError(parameter, 'must be a proportion between 0 and 1');
}

/**
 * Standard error of one share under simple random sampling, √(p(1−p)/n).
 *
 * @param p - share, proportion in [0, 1].
 * @param n - (effective) sample size, > 0.
 * @throws {MetricInputError} `p` or `n`.
 * @returns SE as a proportion, in [0, 0.5/√n].
 * @example shareSe(0.5, 1000) // => 0.015811…
 */
export function shareSe(p: number, n: number): number {
  requireProportion('p', p);
  requirePositive('n', n);
  return Math.sqrt((p * (1 - p)) / n);
}

/**
 * 95% margin of error of one share, z·√(p(1−p)/n), as a proportion.
 *
 * @param p - share, proportion in [0, 1].
 * @param n - (effective) sample size, > 0.
 * @throws {MetricInputError} `p` or `n`.
 * @example shareMoe(0.5, 1000) // => 0.030990…
 */
export function shareMoe(p: number, n: number): number {
  return Z95 * shareSe(p, n);
}

/**
 * Standard error of the margin p_A − p_B when both shares come from one
 * multinomial sample: Var = [p_A + p_B − (p_A − p_B)²]/n. The covariance
 * −p_A·p_B/n makes this about twice a share's SE: judging a margin error
 * against the published share MOE is a known error.
 *
 * @param pA - share of A, proportion in [0, 1]; `pB` likewise, pA + pB ≤ 1 (+1e-9).
 * @param n - (effective) sample size, > 0.
 * @throws {MetricInputError} `pA`, `pB` (also when pA + pB > 1) or `n`.
 * @returns SE as a proportion.
 * @example marginSe(0.48, 0.45, 1000) // => 0.030481…
 */
export function marginSe(pA: number, pB: number, n: number): number {
  requireProportion('pA', pA);
  requireProportion('pB', pB);
  if (pA + pB > 1 + 1e-9) throw new MetricInputError('pB', 'must make pA + pB at most 1');
  requirePositive('n', n);
  return Math.sqrt(Math.max(0, pA + pB - (pA - pB) ** 2) / n);
}

/**
 * 95% margin of error of the margin p_A − p_B, z·{@link marginSe}, as a proportion.
 *
 * @throws {MetricInputError} as {@link marginSe}.
 * @example marginMoe(0.5, 0.5, 1000) // => 0.061980…
 */
export function marginMoe(pA: number, pB: number, n: number): number {
  return Z95 * marginSe(pA, pB, n);
}

/** Kish's design effect from weights and the effective sample size it implies. */
export interface KishDesignEffect {
  /** n·Σw²/(Σw)² = 1 + CV² (CV with the n denominator); ≥ 1. */
  deff: number;
  /** n/deff = (Σw)²/Σw², in (0, n]. */
  nEff: number;
}

/**
 * Kish's (1965, *Survey Sampling*) design effect due to unequal weights,
 * deff = n·Σw²/(Σw)² = 1 + CV² with the population CV (n, not n − 1,
 * denominator), and n_eff = n/deff. Sums use simple-statistics' compensated `sum`.
 *
 * @param weights - one weight per respondent, at least 1, each finite and > 0.
 * @throws {MetricInputError} `weights` (empty) or `weights[i]` (not finite or ≤ 0).
 * @example kishDesignEffect([0.5, 1, 1, 1.5, 2]) // => { deff: 1.180555…, nEff: 4.235294… }
 */
export function kishDesignEffect(weights: readonly number[]): KishDesignEffect {
  requireSample('weights', weights, 1);
  weights.forEach((w, i) => requirePositive(`weights[${i}]`, w));
  const n = weights.length;
  const total = sum(weights);
  const squares = sum(weights.map((w) => w * w));
  const deff = (n * squares) / (total * total);
  return { deff, nEff: n / deff };
}

/**
 * The effective sample size a stated 95% MOE implies for a share of 50%:
 * n_eff = z²·0.25/(MOE/100)². Veracast uses it, when a poll states an MOE, so
 * that the firm's own claimed precision is what the intervals test.
 *
 * @param moePts - stated 95% margin of error in **points**, in (0, 100].
 * @throws {MetricInputError} `moePts`.
 * @returns n_eff > 0, not rounded.
 * @example nEffFromStatedMoe(3.1) // => 999.338…
 */
export function nEffFromStatedMoe(moePts: number): number {
  requirePositive('moePts', moePts);
  if (moePts > 100) throw new MetricInputError('moePts', 'must be at most 100 points');
  return (Z95 * Z95 * 0.25) / (moePts / 100) ** 2;
}

/** A confidence interval for a proportion. */
export interface ProportionInterval {
  lower: number;
  upper: number;
  /** (x + z²/2)/(n + z²), the interval's midpoint. */
  centre: number;
}

/**
 * Wilson (1927, *JASA* 22:209–212) score interval at 95% for x successes in n:
 * centre (x + z²/2)/(n + z²), half-width z√n/(n + z²)·√(p̂(1−p̂) + z²/(4n)),
 * p̂ = x/n. Bounds are clamped to [0, 1] against rounding (at x = 0 the lower
 * bound is exactly 0 in theory). x and n may be effective (non-integer) counts.
 *
 * @param x - successes, in [0, n].
 * @param n - trials, > 0.
 * @throws {MetricInputError} `x` or `n`.
 * @returns proportions, 0 ≤ lower ≤ centre ≤ upper ≤ 1.
 * @example wilsonInterval(81, 263) // => { lower: 0.255289…, upper: 0.366210…, centre: 0.310749… }
 */
export function wilsonInterval(x: number, n: number): ProportionInterval {
  requirePositive('n', n);
  requireFinite('x', x);
  if (x < 0 || x > n) throw new MetricInputError('x', 'must be between 0 and n');
  const z2 = Z95 * Z95;
  const pHat = x / n;
  const centre = (x + z2 / 2) / (n + z2);
  const half = ((Z95 * Math.sqrt(n)) / (n + z2)) * Math.sqrt(pHat * (1 - pHat) + z2 / (4 * n));
  return { lower: Math.max(0, centre - half), upper: Math.min(1, centre + half), centre };
}
