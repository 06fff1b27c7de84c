/**
 * Correlation of every pair of firms' errors over the contests both polled, raw and after
 * removing each contest's bias as estimated by the other firms.
 */
import { pearson, spearman } from './correlation';
import { validateFirmContestErrors, type FirmContestError } from './house-effects';
import { allEqual, compareKeys, groupBy, meanOf, requireInteger } from './internal';

/** Options of {@link pairwiseFirmCorrelations}. */
export interface PairwiseOptions {
  /** Fewest common contests for a pair to be analysed (default 5, at least 3). */
  readonly minCommon?: number;
}

/** One pair of firms (a < b in key order). Correlations are null when not computable. */
export interface FirmPairCorrelation {
  readonly a: string;
  readonly b: string;
  /** Contests both firms polled. */
  readonly n: number;
  /** Pearson's r of the two firms' errors over the n common contests. */
  readonly pearson: number | null;
  readonly pearsonP: number | null;
  /** Spearman's ρ_s over the same contests (average ranks). */
  readonly spearman: number | null;
  /** Approximate (t-based) p of ρ_s. */
  readonly spearmanP: number | null;
  /** Common contests that some third firm also polled (used by `pearsonAdjusted`). */
  readonly nAdjusted: number;
  /** Pearson's r after subtracting from both errors the contest bias of the other firms. */
  readonly pearsonAdjusted: number | null;
  readonly pearsonAdjustedP: number | null;
  /** True when n < minCommon: every statistic is null. */
  readonly insufficient: boolean;
  /** Why a statistic is null, in plain words; null when all were computed. */
  readonly note: string | null;
}

/**
 * Pairwise correlation of firms' errors over common contests.
 *
 * Each firm counts once per contest: callers pass final polls; if a firm still has several
 * polls in a contest, their errors are averaged into one. For each pair (a, b):
 * - raw: Pearson r (t test) and Spearman ρ_s (t approximation) over the n contests both polled;
 * - adjusted: for each common contest, b̂_c^(−ab) = mean of the per-firm errors of all other
 *   firms in the contest (each firm weighted once); Pearson r of (e_a − b̂_c^(−ab),
 *   e_b − b̂_c^(−ab)). Contests that no third firm polled drop out of it. Raw errors of two firms
 *   correlate mostly through the shared contest error; the adjusted r asks whether they share
 *   more than that (e.g. a common method).
 * A pair with n < minCommon is flagged `insufficient` with null statistics; the adjusted r is
 * null when fewer than minCommon contests remain for it. A correlation is also null (with a
 * note) when one side has zero variance. Never NaN.
 *
 * @param polls errors with contest and firm keys (at least 1).
 * @param options `minCommon` (integer ≥ 3, default 5).
 * @throws MetricInputError naming `polls` (empty, bad field) or `options.minCommon`.
 * @returns one entry per pair of firms, ordered by (a, b).
 */
export function pairwiseFirmCorrelations(
  polls: readonly FirmContestError[],
  options: PairwiseOptions = {},
): FirmPairCorrelation[] {
  validateFirmContestErrors(polls);
  const minCommon = options.minCommon ?? 5;
  requireInteger('options.minCommon', minCommon, 3);

  // contest → firm → averaged error
  const byContest = new Map<string, Map<string, number>>();
  for (const [contestKey, rows] of groupBy(polls, (p) => p.contestKey)) {
    const perFirm = new Map<string, number>();
    for (const [firm, firmRows] of groupBy(rows, (r) => r.firm)) {
      perFirm.set(firm, meanOf(firmRows.map((r) => r.error)));
    }
    byContest.set(contestKey, perFirm);
  }
  const firms = [...new Set(polls.map((p) => p.firm))].sort(compareKeys);
  if (firms.length < 2) return [];

  const out: FirmPairCorrelation[] = [];
  for (let i = 0; i < firms.length; i++) {
    for (let j = i + 1; j < firms.length; j++) {
      out.push(analysePair(firms[i] as string, firms[j] as string, byContest, minCommon));
    }
  }
  return out;
}

function analysePair(
  a: string,
  b: string,
  byContest: ReadonlyMap<string, ReadonlyMap<string, number>>,
  minCommon: number,
): FirmPairCorrelation {
  const xa: number[] = [];
  const xb: number[] = [];
  const adjA: number[] = [];
  const adjB: number[] = [];
  for (const perFirm of byContest.values()) {
    const ea = perFirm.get(a);
    const eb = perFirm.get(b);
    if (ea === undefined || eb === undefined) continue;
    xa.push(ea);
    xb.push(eb);
    const others = [...perFirm.entries()].filter(([f]) => f !== a && f !== b).map(([, e]) => e);
    if (others.length > 0) {
      const bias = meanOf(others);
      adjA.push(ea - bias);
      adjB.push(eb - bias);
    }
  }
  const n = xa.length;
  const base = { a, b, n, nAdjusted: adjA.length };
  if (n < minCommon) {
    return {
      ...base,
      pearson: null,
      pearsonP: null,
      spearman: null,
      spearmanP: null,
      pearsonAdjusted: null,
      pearsonAdjustedP: null,
      insufficient: true,
      note: `only ${n} common contest${n === 1 ? '' : 's'}; at least ${minCommon} are needed`,
    };
  }
  const notes: string[] = [];
  let raw: { r: number; p: number; rho: number; rhoP: number } | null = null;
  if (allEqual(xa) || allEqual(xb)) {
    notes.push(`${allEqual(xa) ? a : b} has the same error in every common contest`);
  } else {
    const pr = pearson(xa, xb);
    const sp = spearman(xa, xb);
    raw = { r: pr.r, p: pr.p, rho: sp.rho, rhoP: sp.p };
  }
  let adjusted: { r: number; p: number } | null = null;
  if (adjA.length < minCommon) {
    notes.push(
      `only ${adjA.length} common contest${adjA.length === 1 ? ' was' : 's were'} also polled by another firm; at least ${minCommon} are needed for the adjusted correlation`,
    );
  } else if (allEqual(adjA) || allEqual(adjB)) {
    notes.push('the adjusted errors of one firm do not vary');
  } else {
    const pr = pearson(adjA, adjB);
    adjusted = { r: pr.r, p: pr.p };
  }
  return {
    ...base,
    pearson: raw?.r ?? null,
    pearsonP: raw?.p ?? null,
    spearman: raw?.rho ?? null,
    spearmanP: raw?.rhoP ?? null,
    pearsonAdjusted: adjusted?.r ?? null,
    pearsonAdjustedP: adjusted?.p ?? null,
    insufficient: false,
    note: notes.length > 0 ? notes.join('; ') : null,
  };
}
