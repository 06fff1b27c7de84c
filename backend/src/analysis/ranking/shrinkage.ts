/**
 * Between-firm variance (DerSimonian–Laird) and empirical-Bayes shrinkage of
 * firm means (METHODS §6–7).
 */
import { sum } from 'simple-statistics';
import { derSimonianLaird as sharedDerSimonianLaird } from '../shared-error/dersimonian-laird';
import { MetricInputError, requireFinite, requirePositive } from '../errors';
import { requireArray, requireNonNegative } from './validate';

export interface DerSimonianLairdResult {
  /** Number of estimates k (>= 2). */
  readonly k: number;
  /** Cochran's Q = Σ w (y − μ_FE)², w = 1/v. */
  readonly Q: number;
  /** Degrees of freedom of Q: k − 1. */
  readonly df: number;
  /** Upper-tail χ² p-value of Q on k − 1 df (test of no between-estimate variance). */
  readonly pQ: number;
  /** C = Σw − Σw²/Σw. */
  readonly C: number;
  /** τ² = max(0, (Q − (k − 1))/C), same units as v (points²). */
  readonly tau2: number;
  /** Fixed-effect (inverse-variance) mean and its SE √(1/Σw). */
  readonly muFE: number;
  readonly seFE: number;
  /** Random-effects mean with weights 1/(v + τ²) and its SE. */
  readonly muRE: number;
  readonly seRE: number;
  /** I² = max(0, (Q − (k − 1))/Q), 0 when Q = 0; a fraction in [0, 1). */
  readonly I2: number;
}

/**
 * DerSimonian & Laird (1986, *Controlled Clinical Trials* 7:177–188)
 * method-of-moments estimate of the variance τ² between true values behind k
 * estimates y_i with known sampling variances v_i.
 *
 * w_i = 1/v_i; μ_FE = Σw·y/Σw; Q = Σw(y − μ_FE)²; C = Σw − Σw²/Σw;
 * τ² = max(0, (Q − (k−1))/C); μ_RE = Σw*·y/Σw* with w* = 1/(v + τ²), SE √(1/Σw*);
 * I² = max(0, (Q − (k−1))/Q).
 *
 * @param y estimates, at least 2, finite (e.g. firm means in points).
 * @param v their sampling variances, same length, each > 0 (points²).
 * @throws MetricInputError `y` (fewer than 2 or non-finite), `v` (length differs,
 *   or an entry not > 0).
 * @returns τ², Q with its p-value, fixed- and random-effects means, I².
 * @example
 * derSimonianLaird([2.1, -0.5, 3.4, 1.2, 0.8], [1.0, 1.5, 0.8, 2.0, 1.2]).tau2; // → 1.143996… (METHODS §6)
 */
export function derSimonianLaird(y: readonly number[], v: readonly number[]): DerSimonianLairdResult {
  // One implementation serves both cores: the shared-error one, under this core's field names.
  const r = sharedDerSimonianLaird(y, v);
  return { k: r.k, Q: r.q, df: r.df, pQ: r.qP, C: r.c, tau2: r.tau2, muFE: r.muFE, seFE: r.seFE, muRE: r.muRE, seRE: r.seRE, I2: r.i2 };
}

/**
 * Pooled within-group variance (one-way ANOVA mean square within):
 * σ² = Σ_g Σ_j (x_gj − x̄_g)² / (N − G), with N values in G groups.
 * Groups of one value add nothing to the sum and nothing to the df.
 *
 * @param groups at least one group, each with at least one finite value.
 * @throws MetricInputError `groups` (empty), `groups[g]` (empty or non-finite entry),
 *   `groups` again when N − G < 1 (no group has two values: σ² is not estimable).
 * @returns `{ sigma2, df, ss }`; sigma2 >= 0 (0 when every group is constant).
 * @example
 * pooledWithinVariance([[1, 3], [2, 2, 5]]); // → { sigma2: 2.666667, df: 3, ss: 8 }
 */
export function pooledWithinVariance(groups: readonly (readonly number[])[]): {
  sigma2: number;
  df: number;
  ss: number;
} {
  requireArray('groups', groups, 1);
  let n = 0;
  const ssParts = groups.map((g, gi) => {
    requireArray(`groups[${gi}]`, g, 1);
    g.forEach((x, i) => requireFinite(`groups[${gi}][${i}]`, x));
    n += g.length;
    const m = sum(g) / g.length;
    return sum(g.map((x) => (x - m) ** 2));
  });
  const df = n - groups.length;
  if (df < 1) throw new MetricInputError('groups', 'must contain a group with at least 2 values');
  const ss = sum(ssParts);
  return { sigma2: ss / df, df, ss };
}

/**
 * Between-firm variance τ² of firm means: DerSimonian–Laird with each firm's
 * sampling variance v_f = σ²/n_f (σ² the within-firm variance of one poll's value).
 *
 * @param firms at least 2 `{ mean, n }` (mean finite, n > 0).
 * @param sigma2 within-firm variance, > 0 (points²).
 * @throws MetricInputError `firms`, `firms[i].mean`, `firms[i].n`, `sigma2`.
 * @example
 * betweenFirmVariance([{ mean: -1, n: 4 }, { mean: 1, n: 4 }], 2).tau2; // → 1.5
 */
export function betweenFirmVariance(
  firms: readonly { readonly mean: number; readonly n: number }[],
  sigma2: number,
): DerSimonianLairdResult {
  requireArray('firms', firms, 2);
  requirePositive('sigma2', sigma2);
  firms.forEach((f, i) => {
    if (Number.isFinite(f.mean) && Number.isFinite(f.n) && f.n > 0) return; // names are built only on failure
    requireFinite(`firms[${i}].mean`, f.mean);
    requirePositive(`firms[${i}].n`, f.n);
  });
  return derSimonianLaird(
    firms.map((f) => f.mean),
    firms.map((f) => sigma2 / f.n),
  );
}

export interface ShrinkResult {
  /** Shrinkage factor B = (σ²/n)/(σ²/n + τ²) in (0, 1]; 1 = pulled all the way to μ. */
  readonly B: number;
  /** μ + (1 − B)(ȳ − μ), points. */
  readonly shrunk: number;
  /** √[(1 − B)σ²/n], points. */
  readonly posteriorSd: number;
}

/**
 * Empirical-Bayes (normal–normal) shrinkage of one firm's mean toward μ
 * (Efron & Morris 1975, *JASA* [memory]; METHODS §7):
 *   B = (σ²/n)/(σ²/n + τ²),  shrunk = μ + (1 − B)(ȳ − μ),  posterior SD = √[(1 − B)σ²/n].
 * Few polls (large σ²/n) or little between-firm spread (small τ²) pull harder.
 *
 * @param firm `{ mean, n }`: the firm's mean ȳ (finite) over n > 0 polls.
 * @param sigma2 within-firm variance σ² > 0.
 * @param tau2 between-firm variance τ² >= 0 (τ² = 0 gives B = 1, shrunk = μ, SD 0).
 * @param mu the value shrunk toward, finite.
 * @throws MetricInputError `firm.mean`, `firm.n`, `sigma2`, `tau2`, `mu`.
 * @example
 * empiricalBayesShrink({ mean: 2.5, n: 3 }, 4, 1, 0);
 * // → { B: 0.571429…, shrunk: 1.071429…, posteriorSd: 0.755929… } (METHODS §7)
 */
export function empiricalBayesShrink(
  firm: { readonly mean: number; readonly n: number },
  sigma2: number,
  tau2: number,
  mu: number,
): ShrinkResult {
  requireFinite('firm.mean', firm?.mean);
  requirePositive('firm.n', firm.n);
  requirePositive('sigma2', sigma2);
  requireNonNegative('tau2', tau2);
  requireFinite('mu', mu);
  const v = sigma2 / firm.n;
  const B = v / (v + tau2);
  return { B, shrunk: mu + (1 - B) * (firm.mean - mu), posteriorSd: Math.sqrt((1 - B) * v) };
}

/** A firm's values summarised for `shrinkFirmMeans`. */
export interface FirmSummary {
  /** Mean of the firm's values (points). */
  readonly mean: number;
  /** Number of values, > 0. */
  readonly n: number;
  /** Σ (x − mean)² over the firm's values, >= 0. */
  readonly ss: number;
}

export interface FirmShrinkage {
  /** True when σ² and τ² could be estimated and shrinkage was applied. */
  readonly applied: boolean;
  /** Why shrinkage was not applied (null when it was). */
  readonly note: string | null;
  /** Pooled within-firm variance σ² (null when not estimable). */
  readonly sigma2: number | null;
  /** Its degrees of freedom N − F. */
  readonly withinDf: number;
  /** DerSimonian–Laird τ² (null when not estimable). */
  readonly tau2: number | null;
  /** The target μ. */
  readonly mu: number;
  /** Per firm, aligned with the input. Not applied: B = 0, shrunk = mean, posteriorSd = null. */
  readonly firms: readonly { B: number; shrunk: number; posteriorSd: number | null }[];
}

/**
 * The whole shrinkage step used by scorecards and by every bootstrap draw:
 * pooled within-firm σ² = Σ ss / (N − F); τ² by DerSimonian–Laird over the firm
 * means with v_f = σ²/n_f; then `empiricalBayesShrink` of each firm toward `mu`.
 * When it cannot be estimated (fewer than 2 firms, no firm with 2 values, or
 * σ² = 0) the means are returned unshrunk with `applied: false` and a note.
 *
 * @param firms at least one summary; `mean` finite, `n` > 0, `ss` >= 0.
 * @param mu target, default 0 (for contest-adjusted excess error, 0 is the
 *   poll-weighted mean of all d_j when each firm has one poll per contest).
 * @throws MetricInputError `firms`, `firms[i].mean|n|ss`, `mu`.
 * @example
 * shrinkFirmMeans([{ mean: -1, n: 4, ss: 3 }, { mean: 1, n: 4, ss: 9 }]).firms[1].shrunk; // → 0.75
 */
export function shrinkFirmMeans(firms: readonly FirmSummary[], mu = 0): FirmShrinkage {
  requireArray('firms', firms, 1);
  firms.forEach((f, i) => {
    if (Number.isFinite(f.mean) && Number.isFinite(f.n) && f.n > 0 && Number.isFinite(f.ss) && f.ss >= 0) return; // names are built only on failure
    requireFinite(`firms[${i}].mean`, f.mean);
    requirePositive(`firms[${i}].n`, f.n);
    requireNonNegative(`firms[${i}].ss`, f.ss);
  });
  requireFinite('mu', mu);
  const n = sum(firms.map((f) => f.n));
  const withinDf = n - firms.length;
  const unshrunk = (note: string, sigma2: number | null): FirmShrinkage => ({
    applied: false,
    note,
    sigma2,
    withinDf,
    tau2: null,
    mu,
    firms: firms.map((f) => ({ B: 0, shrunk: f.mean, posteriorSd: null })),
  });
  if (firms.length < 2) return unshrunk('fewer than 2 firms: no between-firm variance', null);
  if (withinDf < 1) return unshrunk('no firm has 2 values: within-firm variance not estimable', null);
  const sigma2 = sum(firms.map((f) => f.ss)) / withinDf;
  if (!(sigma2 > 0)) return unshrunk('within-firm variance is 0', sigma2);
  const { tau2 } = betweenFirmVariance(firms, sigma2);
  return {
    applied: true,
    note: null,
    sigma2,
    withinDf,
    tau2,
    mu,
    firms: firms.map((f) => empiricalBayesShrink(f, sigma2, tau2, mu)),
  };
}
