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

  const byFirm = new Map<string, FirmContests>();
  // contest → firm → averaged error; contests and each contest's firms in key order.
  const contests: ContestErrors[] = [];
  for (const rows of groupBy(polls, (p) => p.contestKey).values()) {
    const firms: string[] = [];
    const errors: number[] = [];
    for (const [firm, firmRows] of groupBy(rows, (r) => r.firm)) {
      firms.push(firm);
      errors.push(meanOf(firmRows.map((r) => r.error)));
    }
    contests.push({ errors });
    firms.forEach((firm, position) => {
      let entry = byFirm.get(firm);
      if (!entry) byFirm.set(firm, (entry = { contests: [], positions: [], errors: [] }));
      entry.contests.push(contests.length - 1);
      entry.positions.push(position);
      entry.errors.push(errors[position] as number);
    });
  }
  const firms = [...byFirm.keys()].sort(compareKeys);
  if (firms.length < 2) return [];

  const out: FirmPairCorrelation[] = [];
  for (let i = 0; i < firms.length; i++) {
    for (let j = i + 1; j < firms.length; j++) {
      const a = firms[i] as string;
      const b = firms[j] as string;
      out.push(analysePair(a, b, byFirm.get(a) as FirmContests, byFirm.get(b) as FirmContests, contests, minCommon));
    }
  }
  return out;
}

/** One contest: the averaged error of each firm that polled it, firms in key order. */
interface ContestErrors {
  readonly errors: readonly number[];
}

/** One firm's contests (indexes into the contest list, ascending), its place in each and its error. */
interface FirmContests {
  readonly contests: number[];
  readonly positions: number[];
  readonly errors: number[];
}

/**
 * Mean of `xs` without the entries at `skipA` and `skipB`, summed in order exactly as `meanOf`
 * (simple-statistics' compensated sum) would sum the remaining entries, so the result is the same
 * to the last bit as building that array and calling `meanOf`.
 */
function meanWithout(xs: readonly number[], skipA: number, skipB: number): number {
  let started = false;
  let sum = 0;
  let correction = 0;
  let count = 0;
  for (let i = 0; i < xs.length; i++) {
    if (i === skipA || i === skipB) continue;
    const x = xs[i] as number;
    count++;
    if (!started) {
      sum = x;
      started = true;
      continue;
    }
    const transition = sum + x;
    if (Math.abs(sum) >= Math.abs(x)) correction += sum - transition + x;
    else correction += x - transition + sum;
    sum = transition;
  }
  return (sum + correction) / count;
}

const tooFewNotes = new Map<string, string>();
/** The note of a pair with too few common contests (one string per (n, minCommon)). */
function tooFewNote(n: number, minCommon: number): string {
  const k = `${n}/${minCommon}`;
  let note = tooFewNotes.get(k);
  if (note === undefined) {
    note = `only ${n} common contest${n === 1 ? '' : 's'}; at least ${minCommon} are needed`;
    tooFewNotes.set(k, note);
  }
  return note;
}

function analysePair(
  a: string,
  b: string,
  fa: FirmContests,
  fb: FirmContests,
  contests: readonly ContestErrors[],
  minCommon: number,
): FirmPairCorrelation {
  // Common contests in contest order: a merge of the two firms' ascending contest lists.
  let n = 0;
  let nAdjusted = 0;
  for (let i = 0, j = 0; i < fa.contests.length && j < fb.contests.length; ) {
    const ca = fa.contests[i] as number;
    const cb = fb.contests[j] as number;
    if (ca < cb) i++;
    else if (cb < ca) j++;
    else {
      n++;
      if ((contests[ca] as ContestErrors).errors.length > 2) nAdjusted++;
      i++;
      j++;
    }
  }
  if (n < minCommon) {
    // Most pairs end here (firms rarely share many contests): one literal, the note reused.
    return {
      a,
      b,
      n,
      nAdjusted,
      pearson: null,
      pearsonP: null,
      spearman: null,
      spearmanP: null,
      pearsonAdjusted: null,
      pearsonAdjustedP: null,
      insufficient: true,
      note: tooFewNote(n, minCommon),
    };
  }
  const base = { a, b, n, nAdjusted };
  const xa: number[] = new Array<number>(n);
  const xb: number[] = new Array<number>(n);
  const adjA: number[] = new Array<number>(nAdjusted);
  const adjB: number[] = new Array<number>(nAdjusted);
  let k = 0;
  let m = 0;
  for (let i = 0, j = 0; i < fa.contests.length && j < fb.contests.length; ) {
    const ca = fa.contests[i] as number;
    const cb = fb.contests[j] as number;
    if (ca < cb) i++;
    else if (cb < ca) j++;
    else {
      const ea = fa.errors[i] as number;
      const eb = fb.errors[j] as number;
      xa[k] = ea;
      xb[k] = eb;
      k++;
      const errors = (contests[ca] as ContestErrors).errors;
      if (errors.length > 2) {
        const bias = meanWithout(errors, fa.positions[i] as number, fb.positions[j] as number);
        adjA[m] = ea - bias;
        adjB[m] = eb - bias;
        m++;
      }
      i++;
      j++;
    }
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
