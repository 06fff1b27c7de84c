/**
 * Every per-poll metric of SPEC §4 in one call: the function audits use.
 *
 * Conventions (METHODS §0–5):
 * - Shares and errors in points; signed errors positive when the poll overstated A.
 * - The undecided treatment is applied to the poll; under `two_party` the
 *   certified shares are made two-party too, so both sides compare alike.
 * - Margin error, share errors, Mosteller's M3 and M5, A′/B and coverage use
 *   the treated shares. MTK's A and the two-party share error depend on ratios
 *   of A to B only, so they are the same under every treatment; MTK's SE needs
 *   respondent counts and so uses the published (raw) shares. Winner called
 *   reads signs only, from the raw shares.
 * - Sample sizes: `nDesign` = n/designEffect feeds MTK's SE and A′'s SE and
 *   tests; `nEff` feeds the coverage intervals and is the firm's own claimed
 *   precision z²·0.25/(MOE/100)² when the poll states an MOE, else `nDesign`.
 *   Neither is reduced for undecided respondents under `proportional`.
 * - A metric the poll's data cannot define comes back as null with a reason in
 *   `notes`, never NaN. Malformed input throws `MetricInputError`.
 */
import { sum } from 'simple-statistics';
import { MetricInputError, requirePositive } from '../errors';
import { aeAccuracy, mergeEmptyCategories } from './arzheimer-evans';
import { marginCovered as marginCoverage, shareCovered as shareCoverage } from './coverage';
import { daysOut as computeDaysOut } from './days-out';
import {
  lean as leanOf,
  shareErrors as computeShareErrors,
  signedMarginError,
  twoPartyShareError as tpse,
  winnerCalled as called,
  type Lean,
} from './margin';
import { mosteller3 as computeMosteller3, mosteller5 as computeMosteller5 } from './mosteller';
import { mtkAccuracy } from './mtk';
import { certifiedShares, referencePair, type ContestInput, type ReferenceBasis } from './reference-pair';
import { nEffFromStatedMoe } from './sampling';
import { OTHER, TIE_TOLERANCE_PTS, UNDECIDED, hasShare, requireShare, requireShares, type Shares } from './shares';
import { applyUndecided, requireTreatment, type UndecidedTreatment } from './undecided';

/** One published poll of the contest. */
export interface PollInput {
  /** Sample size, a positive integer. */
  readonly n: number;
  /** Stated 95% margin of error in points, in (0, 100], or null when not stated. */
  readonly moe: number | null;
  /** `YYYY-MM-DD`. */
  readonly fieldworkStart: string;
  /** `YYYY-MM-DD`, not before the start. */
  readonly fieldworkEnd: string;
  /** Points keyed by option key, `undecided` and `other` allowed; summing to at most 100.5. */
  readonly shares: Shares;
}

/** The contest with its certified votes and election date. */
export interface PollContestInput extends ContestInput {
  /** `YYYY-MM-DD`. */
  readonly electionDate: string;
}

/** Settings of the audit that bear on one poll. */
const PREPARED = Symbol('prepared contest');

/** A contest checked once, with its reference pair and certified shares (see {@link preparePollContest}). */
export interface PreparedPollContest extends PollContestInput {
  readonly [PREPARED]: { readonly pair: ReturnType<typeof referencePair>; readonly certified: Readonly<Record<string, number>> };
}

/**
 * Checks a contest and computes, once, what every poll of it shares (its reference pair and
 * certified shares), for computing many polls of one contest: `computePollMetrics` with the
 * result gives exactly what it gives with the contest itself. Both are frozen (never changed).
 *
 * @throws {MetricInputError} as `computePollMetrics` does for the contest (`options…`, `orientation`).
 * @returns a new object: the contest's fields and the prepared values.
 */
export function preparePollContest(contest: PollContestInput): PreparedPollContest {
  const pair = Object.freeze(referencePair(contest));
  const certified = Object.freeze(certifiedShares(contest.options));
  return { ...contest, [PREPARED]: Object.freeze({ pair, certified }) };
}

export interface PollMetricSettings {
  readonly undecided: UndecidedTreatment;
  /** Design effect the audit assumes, > 0 (1 for simple random sampling). */
  readonly designEffect: number;
}

/** Where `nEff` came from. */
export type NEffBasis = 'stated_moe' | 'design_effect';

/** Every per-poll metric. Points unless a field says otherwise. */
export interface PollMetrics {
  treatment: UndecidedTreatment;
  refA: string;
  refB: string;
  refBasis: ReferenceBasis;
  /** Certified winner and runner-up. */
  winner: string;
  runnerUp: string;
  /** Treated poll shares of A and B. */
  pollA: number;
  pollB: number;
  /** Certified shares of A and B (two-party under `two_party`). */
  resultA: number;
  resultB: number;
  /** (p_A − p_B) − (V_A − V_B) on treated shares; > 0 overstated A. */
  marginError: number;
  absMarginError: number;
  lean: Lean;
  /** p_i − V_i over `mosteller3Set`, treated shares. */
  shareErrors: Record<string, number>;
  /** 100·[p_A/(p_A+p_B) − V_A/(V_A+V_B)]; null when the poll gives A and B 0 both. */
  twoPartyShareError: number | null;
  mosteller3: number;
  /** The scored set of M3: options with a share on both sides, undecided never. */
  mosteller3Set: string[];
  /** M5 on the certified top two; null when the (treated) poll lacks one of them. */
  mosteller5: number | null;
  /** MTK's A (log odds ratio, unitless) and its test; null when a share of A or B is 0. */
  mtkA: number | null;
  mtkSe: number | null;
  mtkZ: number | null;
  mtkP: number | null;
  mtkLower: number | null;
  mtkUpper: number | null;
  /** Arzheimer–Evans A′ per category (unitless); null with fewer than 2 usable categories. */
  aePrime: Record<string, number> | null;
  aeSe: Record<string, number> | null;
  aeB: number | null;
  aeBw: number | null;
  aeChi2: number | null;
  aeG2: number | null;
  aeDf: number | null;
  aeChi2P: number | null;
  aeG2P: number | null;
  /** Empty categories pooled before A′ (see `mergeEmptyCategories`). */
  aeMerges: string[];
  /** The poll's leader was the certified winner; null for no call. */
  winnerCalled: boolean | null;
  /** Certified share of A inside the poll's 95% interval for A's share. */
  shareCovered: boolean | null;
  shareInterval: [number, number] | null;
  /** Certified margin inside the poll's 95% interval for the margin. */
  marginCovered: boolean | null;
  marginInterval: [number, number] | null;
  /** Election date minus fieldwork midpoint, days (may be x.5). */
  daysOut: number;
  /** Election date minus fieldwork end, days. */
  daysOutEnd: number;
  /** Published undecided share, points (0 when absent). */
  undecidedShare: number;
  /** Effective sample size of the coverage intervals. */
  nEff: number;
  nEffBasis: NEffBasis;
  /** n/designEffect, used for MTK's and A′'s standard errors. */
  nDesign: number;
  /** Why a metric is null, and what was left out; plain sentences. */
  notes: string[];
}

function requireSettings(settings: PollMetricSettings): void {
  if (settings === null || typeof settings !== 'object') throw new MetricInputError('settings', 'must be an object');
  requireTreatment('undecided', settings.undecided);
  requirePositive('designEffect', settings.designEffect);
}

function requirePoll(poll: PollInput): void {
  if (poll === null || typeof poll !== 'object') throw new MetricInputError('poll', 'must be an object');
  if (!Number.isInteger(poll.n) || poll.n < 1) throw new MetricInputError('n', 'must be a positive integer');
  if (poll.moe !== null) {
    requirePositive('moe', poll.moe);
    if (poll.moe > 100) throw new MetricInputError('moe', 'must be at most 100 points');
  }
  requireShares('shares', poll.shares);
  if (sum(Object.values(poll.shares)) > 100.5) {
    throw new MetricInputError('shares', 'must not sum past 100.5 points');
  }
}

/**
 * Computes every per-poll metric of SPEC §4 for one poll of one contest.
 *
 * @param poll - see {@link PollInput}; never mutated.
 * @param contest - options with certified votes, orientation blocs or null,
 *   election date; never mutated.
 * @param settings - undecided treatment and design effect.
 * @throws {MetricInputError} naming the bad field: `options…`, `orientation`,
 *   `electionDate`, `fieldworkStart`, `fieldworkEnd`, `n`, `moe`, `shares`
 *   (sum past 100.5), `shares.<key>` (a bad share, or no share for A or B),
 *   `undecided`, `designEffect`.
 * @returns a new plain {@link PollMetrics} object.
 * @example computePollMetrics(
 *   { n: 1000, moe: null, fieldworkStart: '2026-04-28', fieldworkEnd: '2026-05-01',
 *     shares: { A: 48, B: 44, C: 2, undecided: 6 } },
 *   { electionDate: '2026-05-10', orientation: null, options: [
 *     { key: 'A', bloc: null, votes: 502 }, { key: 'B', bloc: null, votes: 473 }, { key: 'C', bloc: null, votes: 25 }] },
 *   { undecided: 'raw', designEffect: 1 })
 * // => { refA: 'A', refB: 'B', marginError: 1.1…, lean: 'A', winnerCalled: true, daysOut: 10.5, … }
 */
export function computePollMetrics(
  poll: PollInput,
  contest: PollContestInput | PreparedPollContest,
  settings: PollMetricSettings,
): PollMetrics {
  const prepared = contest !== null && typeof contest === 'object' ? (contest as Partial<PreparedPollContest>)[PREPARED] : undefined;
  const pair = prepared?.pair ?? referencePair(contest);
  const certified = prepared?.certified ?? certifiedShares(contest.options);
  requirePoll(poll);
  requireSettings(settings);
  const days = computeDaysOut(contest.electionDate, poll.fieldworkStart, poll.fieldworkEnd);
  const { refA, refB, winner, runnerUp } = pair;
  const raw = poll.shares;
  const rawA = requireShare('shares', raw, refA);
  const rawB = requireShare('shares', raw, refB);
  const treatment = settings.undecided;
  const notes: string[] = [];

  for (const key of Object.keys(raw)) {
    if (key === UNDECIDED || hasShare(certified, key)) continue;
    notes.push(
      key === OTHER
        ? 'The certified result has no option keyed "other", so the poll\'s "other" is left out of M3, share errors and A′.'
        : `The poll's option "${key}" has no certified result; it is left out of M3, share errors and A′.`,
    );
  }

  const treatedPoll = applyUndecided(raw, treatment, refA, refB);
  const treatedResult = treatment === 'two_party' ? applyUndecided(certified, 'two_party', refA, refB) : certified;
  const pollA = requireShare('shares', treatedPoll, refA);
  const pollB = requireShare('shares', treatedPoll, refB);
  const resultA = requireShare('result', treatedResult, refA);
  const resultB = requireShare('result', treatedResult, refB);

  const marginError = signedMarginError(pollA, pollB, resultA, resultB);
  const m3 = computeMosteller3(treatedPoll, treatedResult);

  const resA = certified[refA] ?? 0;
  const resB = certified[refB] ?? 0;
  let twoPartyShareError: number | null = null;
  if (rawA + rawB > 0 && resA + resB > 0) twoPartyShareError = tpse(rawA, rawB, resA, resB);
  else notes.push('The poll or the result gives A and B 0 both: the two-party share error is undefined.');

  let mosteller5: number | null = null;
  if (hasShare(treatedPoll, winner) && hasShare(treatedPoll, runnerUp)) {
    mosteller5 = computeMosteller5(
      treatedPoll[winner] ?? 0,
      treatedPoll[runnerUp] ?? 0,
      treatedResult[winner] ?? 0,
      treatedResult[runnerUp] ?? 0,
    );
  } else {
    notes.push(
      treatment === 'two_party'
        ? 'M5 needs the certified top two, which the two-party treatment of the reference pair drops.'
        : 'M5 needs poll shares for the certified winner and runner-up; the poll lacks one.',
    );
  }

  let winnerCalled: boolean | null = null;
  if (hasShare(raw, winner) && hasShare(raw, runnerUp)) {
    winnerCalled = called(raw[winner] ?? 0, raw[runnerUp] ?? 0, certified[winner] ?? 0, certified[runnerUp] ?? 0);
    if (winnerCalled === null) {
      notes.push(
        Math.abs((certified[winner] ?? 0) - (certified[runnerUp] ?? 0)) < TIE_TOLERANCE_PTS
          ? 'The certified top two are tied: no call, left out of call rates.'
          : 'The poll has the certified top two tied: no call, left out of call rates.',
      );
    }
  } else {
    notes.push('Winner called needs poll shares for the certified winner and runner-up; the poll lacks one.');
  }

  const nDesign = poll.n / settings.designEffect;
  const nEffBasis: NEffBasis = poll.moe !== null ? 'stated_moe' : 'design_effect';
  const nEff = poll.moe !== null ? nEffFromStatedMoe(poll.moe) : nDesign;

  let mtk: ReturnType<typeof mtkAccuracy> | null = null;
  if (rawA > 0 && rawB > 0 && resA > 0 && resB > 0) {
    mtk = mtkAccuracy({ pollA: rawA, pollB: rawB, resultA: resA, resultB: resB, n: nDesign });
  } else {
    notes.push('MTK\'s A needs positive poll and certified shares for A and B; one is 0.');
  }

  const catPoll: Record<string, number> = {};
  const catResult: Record<string, number> = {};
  for (const key of m3.scored) {
    catPoll[key] = treatedPoll[key] ?? 0;
    catResult[key] = treatedResult[key] ?? 0;
  }
  const merged = mergeEmptyCategories(catPoll, catResult);
  const rawCategoryShare = sum(m3.scored.map((k) => raw[k] ?? 0));
  const nCategories = nDesign * Math.min(1, rawCategoryShare / 100);
  let ae: ReturnType<typeof aeAccuracy> | null = null;
  if (Object.keys(merged.poll).length >= 2 && nCategories > 0) {
    ae = aeAccuracy(merged.poll, merged.result, nCategories);
  } else {
    notes.push('A′ and B need at least 2 options with positive poll and certified shares.');
  }
  for (const m of merged.merges) notes.push(`A′: empty categories pooled (${m}).`);

  let shareCheck: ReturnType<typeof shareCoverage> | null = null;
  let marginCheck: ReturnType<typeof marginCoverage> | null = null;
  if (pollA <= 100 && pollA + pollB <= 100) {
    shareCheck = shareCoverage(pollA, resultA, nEff);
    marginCheck = marginCoverage(pollA, pollB, resultA, resultB, nEff);
  } else {
    notes.push('Treated shares of A and B exceed 100 points together: coverage is undefined.');
  }

  if (days.daysOutEnd < 0) notes.push('Fieldwork ended after election day.');

  return {
    treatment,
    refA,
    refB,
    refBasis: pair.basis,
    winner,
    runnerUp,
    pollA,
    pollB,
    resultA,
    resultB,
    marginError,
    absMarginError: Math.abs(marginError),
    lean: leanOf(marginError),
    shareErrors: computeShareErrors(treatedPoll, treatedResult),
    twoPartyShareError,
    mosteller3: m3.value,
    mosteller3Set: m3.scored,
    mosteller5,
    mtkA: mtk?.a ?? null,
    mtkSe: mtk?.se ?? null,
    mtkZ: mtk?.z ?? null,
    mtkP: mtk?.p ?? null,
    mtkLower: mtk?.lower ?? null,
    mtkUpper: mtk?.upper ?? null,
    aePrime: ae?.aPrime ?? null,
    aeSe: ae?.se ?? null,
    aeB: ae?.b ?? null,
    aeBw: ae?.bw ?? null,
    aeChi2: ae?.chi2 ?? null,
    aeG2: ae?.g2 ?? null,
    aeDf: ae?.df ?? null,
    aeChi2P: ae?.chi2P ?? null,
    aeG2P: ae?.g2P ?? null,
    aeMerges: merged.merges,
    winnerCalled,
    shareCovered: shareCheck?.covered ?? null,
    shareInterval: shareCheck ? [shareCheck.lower, shareCheck.upper] : null,
    marginCovered: marginCheck?.covered ?? null,
    marginInterval: marginCheck ? [marginCheck.lower, marginCheck.upper] : null,
    daysOut: days.daysOut,
    daysOutEnd: days.daysOutEnd,
    undecidedShare: hasShare(raw, UNDECIDED) ? (raw[UNDECIDED] ?? 0) : 0,
    nEff,
    nEffBasis,
    nDesign,
    notes,
  };
}
