/**
 * How many independent polls a set of correlated polls is worth, and the interval an
 * average of them should carry.
 *
 * Polls of one contest share the contest's error, so their errors are positively correlated
 * and averaging k of them removes far less error than σ/√k suggests.
 */
import { sum } from 'simple-statistics';
import { MetricInputError, requireFinite, requirePositive } from '../errors';
import { Z95 } from '../distributions';
import { derSimonianLaird } from './dersimonian-laird';
import type { Icc1Result } from './icc';
import { meanOf, requireInteger } from './internal';

/** Result of {@link effectivePolls}. */
export interface EffectivePollsResult {
  readonly k: number;
  readonly rho: number;
  /** Design effect of the average: 1 + (k − 1)ρ ≥ 1. */
  readonly deff: number;
  /** Effective number of independent polls k/[1 + (k − 1)ρ], in [1, k]; tends to 1/ρ. */
  readonly nEff: number;
}

function requireRho(rho: number): void {
  requireFinite('rho', rho);
  if (rho < 0 || rho > 1) throw new MetricInputError('rho', 'must be between 0 and 1');
}

/**
 * Effective number of independent polls among k polls with common pairwise correlation ρ.
 *
 * Var(ȳ) = (σ²/k)[1 + (k − 1)ρ], so deff = 1 + (k − 1)ρ and n_eff = k/deff → 1/ρ as k grows
 * (METHODS §6; Kish 1965). ρ is restricted to [0, 1]: callers truncate a negative intraclass
 * correlation estimate at 0.
 *
 * @param k number of polls, an integer ≥ 1.
 * @param rho pairwise correlation of their errors, in [0, 1].
 * @throws MetricInputError naming `k` or `rho`.
 * @returns deff ≥ 1 and n_eff in [1, k].
 * @example
 * effectivePolls(10, 0.3) // → deff 3.7, nEff 2.702703
 */
export function effectivePolls(k: number, rho: number): EffectivePollsResult {
  requireInteger('k', k, 1);
  requireRho(rho);
  const deff = 1 + (k - 1) * rho;
  return { k, rho, deff, nEff: k / deff };
}

/** Result of {@link pollAverageInterval}. Units: those of `sigma` (points). */
export interface PollAverageInterval extends EffectivePollsResult {
  readonly sigma: number;
  /** σ/√k: the SE if the k polls were independent. */
  readonly naiveSe: number;
  /** σ·√(deff/k) = σ/√n_eff: the SE with correlation ρ. */
  readonly adjustedSe: number;
  /** z₀.₉₇₅ · naiveSe: half-width of the naive 95% interval. */
  readonly naiveHalfWidth: number;
  /** z₀.₉₇₅ · adjustedSe: half-width of the 95% interval the average should carry. */
  readonly adjustedHalfWidth: number;
}

/**
 * The standard error and 95% half-width a k-poll average should carry: naive σ/√k against
 * σ√([1 + (k − 1)ρ]/k) when the polls' errors correlate with ρ. z₀.₉₇₅ = 1.959964.
 *
 * @param sigma SD of one poll's error (points), > 0.
 * @param k number of polls, an integer ≥ 1.
 * @param rho pairwise correlation, in [0, 1].
 * @throws MetricInputError naming `sigma`, `k` or `rho`.
 * @returns naive and adjusted SEs and half-widths, deff, n_eff.
 * @example
 * pollAverageInterval(3, 10, 0.3) // → naiveSe 0.948683, adjustedSe 1.824829
 */
export function pollAverageInterval(sigma: number, k: number, rho: number): PollAverageInterval {
  requirePositive('sigma', sigma);
  const e = effectivePolls(k, rho);
  const naiveSe = sigma / Math.sqrt(k);
  const adjustedSe = sigma * Math.sqrt(e.deff / k);
  return {
    ...e,
    sigma,
    naiveSe,
    adjustedSe,
    naiveHalfWidth: Z95 * naiveSe,
    adjustedHalfWidth: Z95 * adjustedSe,
  };
}

/**
 * An election's error structure, in points²: the variance shared by the polls of a contest
 * and the variance of polls around their contest's mean.
 */
export interface ErrorStructure {
  /** σ_b² ≥ 0: between-contest (shared) variance. */
  readonly sharedVariance: number;
  /** σ_w² ≥ 0: within-contest variance (house effects, noise and sampling error together). */
  readonly withinVariance: number;
}

/**
 * The error structure implied by an ICC(1) fit: σ_b² = max(0, (MSB − MSW)/n₀), σ_w² = MSW.
 * The implied per-poll SD is √(σ_b² + σ_w²) and ρ = σ_b²/(σ_b² + σ_w²), the ICC truncated at 0.
 */
export function errorStructureFromIcc(fit: Icc1Result): ErrorStructure {
  return { sharedVariance: Math.max(0, fit.sigma2Between), withinVariance: fit.msw };
}

/** One poll as a contest summary reads it. */
export interface PollErrorAndVariance {
  /** Signed margin error (points). */
  readonly error: number;
  /** Sampling variance of the poll's margin (points²), > 0. */
  readonly samplingVariance: number;
}

/** Result of {@link contestAverageSummary}. Points unless stated. */
export interface ContestAverageSummary {
  /** Polls in the contest. */
  readonly k: number;
  /** Mean signed error of the polls: the error of their plain average. */
  readonly meanError: number;
  /** √(Σ v_j)/k: SE of the plain average if only sampling error existed. */
  readonly naiveSe: number;
  /** √[(σ²/k)(1 + (k − 1)ρ)] from the election's error structure; null without one. */
  readonly adjustedSe: number | null;
  /** ρ = σ_b²/(σ_b² + σ_w²) used for `adjustedSe`; null without a structure. */
  readonly rho: number | null;
  /** k/[1 + (k − 1)ρ]; null without a structure. */
  readonly nEff: number | null;
  /** DerSimonian–Laird excess variance of this contest's polls (points²); null when k < 2. */
  readonly tau2: number | null;
  /** Cochran's Q of this contest's polls; null when k < 2. */
  readonly q: number | null;
  /** p of Q on k − 1 df; null when k < 2. */
  readonly qP: number | null;
  /** I² of this contest's polls; null when k < 2. */
  readonly i2: number | null;
  /** |meanError| ≤ z₀.₉₇₅·naiveSe: the naive 95% interval of the average held the result. */
  readonly naiveCovered: boolean;
  /** |meanError| ≤ z₀.₉₇₅·adjustedSe; null without a structure. */
  readonly adjustedCovered: boolean | null;
}

/**
 * What interval the average of a contest's polls carried, naively and after allowing for
 * the error the polls of a contest share.
 *
 * - naive: SE = √(Σ v_j)/k, the polls treated as independent samples with only their
 *   sampling variances v_j (from each poll's effective n);
 * - adjusted: the election's error structure (from the one-way ANOVA of errors by contest,
 *   see {@link errorStructureFromIcc}) gives a per-poll SD σ = √(σ_b² + σ_w²) and a within-contest
 *   correlation ρ = σ_b²/σ²; SE = √[(σ²/k)(1 + (k − 1)ρ)] = √(σ_b² + σ_w²/k) and
 *   n_eff = k/[1 + (k − 1)ρ] (METHODS §6). It describes the spread of contest averages around the
 *   election's mean error: an error common to every contest of the election (μ) is tested by the
 *   clustered mean, not covered here.
 * The average's 95% interval (its margin ± z₀.₉₇₅·SE, z = 1.959964) held the certified margin
 * exactly when |mean error| ≤ z₀.₉₇₅·SE; equality counts as held.
 * For diagnosis the contest's own DerSimonian–Laird Q, τ² (excess variance over sampling
 * variance) and I² are reported when k ≥ 2; they do not enter the adjusted SE.
 *
 * @param polls the contest's polls, at least 1, finite errors, sampling variances > 0.
 * @param structure the election's error structure, or null when it could not be estimated.
 * @throws MetricInputError naming `polls`, `polls[i].error`, `polls[i].samplingVariance`,
 *   `structure.sharedVariance` or `structure.withinVariance` (negative, or both zero).
 * @returns the summary; structure-based fields null when `structure` is null, DL fields null
 *   when k < 2.
 * @example
 * contestAverageSummary([{ error: 3, samplingVariance: 9 }, { error: 1, samplingVariance: 16 }],
 *   { sharedVariance: 4, withinVariance: 12 })
 * // → meanError 2, naiveSe 2.5, adjustedSe 3.162278 (√(4 + 12/2)), rho 0.25, nEff 1.6
 */
export function contestAverageSummary(
  polls: readonly PollErrorAndVariance[],
  structure: ErrorStructure | null,
): ContestAverageSummary {
  if (!Array.isArray(polls) || polls.length === 0) {
    throw new MetricInputError('polls', 'must hold at least 1 poll');
  }
  polls.forEach((p, i) => {
    if (Number.isFinite(p.error) && Number.isFinite(p.samplingVariance) && p.samplingVariance > 0) return; // names are built only on failure
    requireFinite(`polls[${i}].error`, p.error);
    requirePositive(`polls[${i}].samplingVariance`, p.samplingVariance);
  });
  if (structure !== null) {
    requireFinite('structure.sharedVariance', structure.sharedVariance);
    requireFinite('structure.withinVariance', structure.withinVariance);
    if (structure.sharedVariance < 0) {
      throw new MetricInputError('structure.sharedVariance', 'must be at least 0');
    }
    if (structure.withinVariance < 0) {
      throw new MetricInputError('structure.withinVariance', 'must be at least 0');
    }
    if (structure.sharedVariance + structure.withinVariance <= 0) {
      throw new MetricInputError('structure.withinVariance', 'must leave a positive total variance');
    }
  }

  const k = polls.length;
  const errors = polls.map((p) => p.error);
  const variances = polls.map((p) => p.samplingVariance);
  const meanError = meanOf(errors);
  const naiveSe = Math.sqrt(sum(variances)) / k;

  let adjustedSe: number | null = null;
  let rho: number | null = null;
  let nEff: number | null = null;
  if (structure !== null) {
    const total = structure.sharedVariance + structure.withinVariance;
    rho = structure.sharedVariance / total;
    const interval = pollAverageInterval(Math.sqrt(total), k, rho);
    adjustedSe = interval.adjustedSe;
    nEff = interval.nEff;
  }
  const dl = k >= 2 ? derSimonianLaird(errors, variances) : null;
  const miss = Math.abs(meanError);
  return {
    k,
    meanError,
    naiveSe,
    adjustedSe,
    rho,
    nEff,
    tau2: dl?.tau2 ?? null,
    q: dl?.q ?? null,
    qP: dl?.qP ?? null,
    i2: dl?.i2 ?? null,
    naiveCovered: miss <= Z95 * naiveSe,
    adjustedCovered: adjustedSe === null ? null : miss <= Z95 * adjustedSe,
  };
}
