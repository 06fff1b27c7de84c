/**
 * Pollster scorecards and fair ranking for one audit (SPEC §5, §7; METHODS §6–7).
 */
import { mean, sumNthPowerDeviations } from 'simple-statistics';
import { MetricInputError, requireFinite } from '../errors';
import { bootstrapRanks, type BootstrapRanksResult } from './bootstrap';
import { clusteredMean } from './clustered';
import { contestAdjustedExcess } from './excess';
import { averageRanks } from './ranks';
import { shrinkFirmMeans } from './shrinkage';
import type { Interval, PollsterId } from './types';
import {
  requireArray,
  requireInteger,
  requireKey,
  requireNonNegative,
  requirePollsterId,
} from './validate';

/** One poll the audit uses (already filtered to its window / final polls). */
export interface ScorecardPoll {
  readonly pollKey: string;
  readonly pollster: PollsterId;
  readonly pollsterName: string;
  readonly contestKey: string;
  readonly electionKey: string;
  /** Margin error in points, oriented by the election's blocs (positive = overstated bloc A). */
  readonly signedError: number;
  /** |margin error| in points against the contest's reference pair, >= 0. */
  readonly absMarginError: number;
  /** Leader was the certified winner; null = tied poll (no call). */
  readonly winnerCalled: boolean | null;
  /** Certified margin inside the poll's 95% margin interval; null = not assessable. */
  readonly marginCovered: boolean | null;
  /** Certified share of A inside the poll's stated interval; null = not assessable. */
  readonly shareCovered: boolean | null;
  /** Disclosure completeness in [0, 1]; null = not assessed. */
  readonly disclosure: number | null;
}

export interface ScorecardSettings {
  /** Minimum polls for a ranked pollster, integer >= 1 (SPEC default 5). */
  readonly minPolls: number;
  /** Seed of the rank bootstrap. */
  readonly seed: number;
  /** Bootstrap draws, integer >= 1 (1000 recommended). */
  readonly draws: number;
}

/** One pollster's scorecard; every error figure is in points. */
export interface ScorecardItem {
  readonly pollsterId: PollsterId;
  readonly pollster: string;
  readonly polls: number;
  readonly contests: number;
  readonly elections: number;
  /** Mean of |margin error|. */
  readonly meanAbsMarginError: number;
  /** Mean signed (bloc-oriented) error: the firm's lean. */
  readonly meanSignedError: number;
  /** 95% CR1 interval clustered by contest, t on G − 1 df; null when G < 2. */
  readonly meanSignedErrorInterval: Interval | null;
  /** Why the interval is null (else null). */
  readonly meanSignedErrorNote: string | null;
  /** √(mean of squared margin errors). */
  readonly rmse: number;
  /** callsCorrect / calls; null when calls = 0. */
  readonly winnerCalledRate: number | null;
  /** Polls with a leader (winnerCalled not null). */
  readonly calls: number;
  readonly callsCorrect: number;
  /** Tied polls, excluded from the rate. */
  readonly noCalls: number;
  /** Share of assessable polls whose margin interval held the certified margin (nominal 0.95). */
  readonly coverageRate: number | null;
  readonly coverageN: number;
  /** Same for the stated share interval (nominal 0.95). */
  readonly shareCoverageRate: number | null;
  readonly shareCoverageN: number;
  /** Mean disclosure completeness (0–1), a separate dimension from accuracy; null when none. */
  readonly disclosure: number | null;
  readonly disclosureN: number;
  /** Contest-adjusted excess error (mean d_j); null when no contest had a rival poll. */
  readonly excessError: number | null;
  /** Polls and contests behind `excessError`. */
  readonly excessErrorN: number;
  readonly excessErrorContests: number;
  /** Empirical-Bayes shrunk excess error toward 0 (= excessError when shrinkage is not applied). */
  readonly excessErrorShrunk: number | null;
  /** Shrinkage factor B (0 = none, 1 = fully to 0). */
  readonly shrinkageFactor: number | null;
  readonly excessErrorPosteriorSd: number | null;
  /** Bootstrap percentile interval (type 7) of excessError, contests resampled. */
  readonly excessErrorInterval: Interval | null;
  /** Same for excessErrorShrunk. */
  readonly excessErrorShrunkInterval: Interval | null;
  /** Average rank among ranked firms by excessErrorShrunk ascending (1 = smallest); null if not ranked. */
  readonly rank: number | null;
  /** Bootstrap rank percentiles (inverted CDF); null if not ranked. */
  readonly rankInterval: Interval | null;
  /** Share of draws ranked first, ties split fractionally; null if not ranked. */
  readonly pRankFirst: number | null;
  /** Share of draws alone in first place; null if not ranked. */
  readonly pSoleFirst: number | null;
  readonly ranked: boolean;
  /** Why not ranked (null when ranked). */
  readonly reason: string | null;
}

export interface ScorecardField {
  readonly polls: number;
  readonly pollsters: number;
  readonly contests: number;
  readonly elections: number;
  /** Mean |margin error| over every poll (all firms). */
  readonly fieldMeanAbsMarginError: number;
  readonly fieldMeanSignedError: number;
  readonly fieldRmse: number;
  readonly fieldWinnerCalledRate: number | null;
  readonly fieldCoverageRate: number | null;
  readonly fieldShareCoverageRate: number | null;
  /** Number of ranked pollsters. */
  readonly ranked: number;
  readonly minPolls: number;
  readonly seed: number;
  readonly draws: number;
  /** Level of every interval: 0.95. */
  readonly level: number;
  /** Nominal coverage the coverage rates are compared with: 0.95. */
  readonly nominalCoverage: number;
  /** Contests resampled by the bootstrap (those polled by at least 2 firms). */
  readonly bootstrapContests: number;
  /** Polls without an excess error (their contest had no rival poll). */
  readonly excessDroppedPolls: number;
  readonly shrinkage: {
    readonly applied: boolean;
    readonly note: string | null;
    readonly sigma2: number | null;
    readonly tau2: number | null;
    readonly mu: number;
  };
  readonly rankedBy: 'excessErrorShrunk ascending';
}

export interface Scorecards {
  /** Ranked pollsters by rank (then name, id), then the unranked by name, id. */
  readonly items: readonly ScorecardItem[];
  readonly field: ScorecardField;
}

const LEVEL = 0.95;

/** √(mean of squares), through simple-statistics' compensated `mean`. */
function rootMeanSquare(xs: readonly number[]): number {
  return Math.sqrt(mean(xs.map((x) => x * x)));
}

function rate(flags: readonly (boolean | null)[]): { rate: number | null; n: number; yes: number } {
  const known = flags.filter((f): f is boolean => f !== null);
  const yes = known.filter((f) => f).length;
  return { rate: known.length > 0 ? yes / known.length : null, n: known.length, yes };
}

function requireFlag(parameter: string, x: unknown): void {
  if (x !== true && x !== false && x !== null) {
    throw new MetricInputError(parameter, 'must be true, false or null');
  }
}

function validate(polls: readonly ScorecardPoll[], settings: ScorecardSettings): void {
  requireArray('polls', polls, 1);
  const keys = new Set<string>();
  const names = new Map<PollsterId, string>();
  const elections = new Map<string, string>();
  const key = (x: unknown) => typeof x === 'string' && x.length > 0;
  const flag = (x: unknown) => x === true || x === false || x === null;
  polls.forEach((p, i) => {
    if (typeof p === 'object' && p !== null && key(p.pollKey) && !keys.has(p.pollKey) && key(p.pollsterName) && key(p.contestKey) && key(p.electionKey)
      && (typeof p.pollster === 'string' ? p.pollster.length > 0 : Number.isFinite(p.pollster))
      && (names.get(p.pollster) ?? p.pollsterName) === p.pollsterName && (elections.get(p.contestKey) ?? p.electionKey) === p.electionKey
      && Number.isFinite(p.signedError) && Number.isFinite(p.absMarginError) && p.absMarginError >= 0
      && flag(p.winnerCalled) && flag(p.marginCovered) && flag(p.shareCovered)
      && (p.disclosure === null || (Number.isFinite(p.disclosure) && p.disclosure >= 0 && p.disclosure <= 1))) {
      // A valid poll (the usual case): recorded without building the names of its fields.
      keys.add(p.pollKey);
      names.set(p.pollster, p.pollsterName);
      elections.set(p.contestKey, p.electionKey);
      return;
    }
    const at = `polls[${i}]`;
    if (typeof p !== 'object' || p === null) throw new MetricInputError(at, 'must be an object');
    requireKey(`${at}.pollKey`, p.pollKey);
    if (keys.has(p.pollKey)) throw new MetricInputError(`${at}.pollKey`, 'must be unique');
    keys.add(p.pollKey);
    requirePollsterId(`${at}.pollster`, p.pollster);
    requireKey(`${at}.pollsterName`, p.pollsterName);
    const name = names.get(p.pollster);
    if (name !== undefined && name !== p.pollsterName) {
      throw new MetricInputError(`${at}.pollsterName`, 'must be the same for every poll of one pollster');
    }
    names.set(p.pollster, p.pollsterName);
    requireKey(`${at}.contestKey`, p.contestKey);
    requireKey(`${at}.electionKey`, p.electionKey);
    const election = elections.get(p.contestKey);
    if (election !== undefined && election !== p.electionKey) {
      throw new MetricInputError(`${at}.electionKey`, 'must be the same for every poll of one contest');
    }
    elections.set(p.contestKey, p.electionKey);
    requireFinite(`${at}.signedError`, p.signedError);
    requireNonNegative(`${at}.absMarginError`, p.absMarginError);
    requireFlag(`${at}.winnerCalled`, p.winnerCalled);
    requireFlag(`${at}.marginCovered`, p.marginCovered);
    requireFlag(`${at}.shareCovered`, p.shareCovered);
    if (p.disclosure !== null) {
      requireFinite(`${at}.disclosure`, p.disclosure);
      if (p.disclosure < 0 || p.disclosure > 1) {
        throw new MetricInputError(`${at}.disclosure`, 'must be between 0 and 1, or null');
      }
    }
  });
  if (typeof settings !== 'object' || settings === null) {
    throw new MetricInputError('settings', 'must be an object');
  }
  requireInteger('settings.minPolls', settings.minPolls, 1);
  requireFinite('settings.seed', settings.seed);
  requireInteger('settings.draws', settings.draws, 1);
}

/**
 * Scorecards of every pollster in an audit, and a fair ranking.
 *
 * Accuracy per pollster (points): mean |margin error|; mean signed error (bloc
 * oriented, the lean) with a 95% CR1 interval clustered by contest on G − 1 df
 * (`clusteredMean`; null with a note when the firm polled fewer than 2 contests);
 * RMSE √(Σe²/n); winner-called rate over polls with a leader (ties are "no call",
 * excluded and counted); margin- and share-interval coverage rates over assessable
 * polls, to compare with the nominal 0.95. Disclosure completeness is reported
 * beside accuracy and never mixed into it.
 *
 * Ranking:
 * 1. excessError = contest-adjusted excess error (`contestAdjustedExcess`, over all
 *    polls so every firm is a rival of the others).
 * 2. excessErrorShrunk = `shrinkFirmMeans` over the firms with an excess error:
 *    pooled within-firm σ² of the d_j, DerSimonian–Laird τ² of the firm means,
 *    shrunk toward μ = 0 (an average firm; with one poll per firm and contest the
 *    poll-weighted mean of all d_j is exactly 0). When σ² or τ² cannot be
 *    estimated the values stay unshrunk and `field.shrinkage.note` says why. When
 *    τ̂² = 0 every firm is shrunk to 0 and all ranked firms tie: the data show no
 *    firm differences beyond noise.
 * 3. A pollster is ranked when it has at least `minPolls` polls AND an excess
 *    error; others are listed with `reason`. Ranks are average ranks among ranked
 *    firms of excessErrorShrunk ascending (smaller = better).
 * 4. `bootstrapRanks` with statistic 'shrunk' (σ², τ² re-estimated in each draw,
 *    contests resampled) gives rankInterval, pRankFirst, pSoleFirst and the
 *    excess-error intervals, so the rank and its interval concern the same quantity.
 *
 * @param polls the audit's polls (at least one); not mutated.
 * @param settings `{ minPolls, seed, draws }`.
 * @throws MetricInputError `polls`, `polls[i].<field>` (missing/invalid, duplicate
 *   pollKey, one pollster id with two names, one contest in two elections,
 *   disclosure outside [0, 1]), `settings.minPolls`, `settings.seed`, `settings.draws`.
 * @returns `{ items, field }`.
 * @example
 * // The hand-computed fixture of scorecards.test.ts (18 polls, 6 firms):
 * computeScorecards(FIXTURE, { minPolls: 3, seed: 20260101, draws: 1000 }).items[0];
 * // → { pollsterId: 1, pollster: 'Alder Research', polls: 4, meanAbsMarginError: 1,
 * //     meanSignedError: 0.5, rmse: 1.224745…, excessError: -2.5, excessErrorShrunk: -2.200179…,
 * //     rank: 1, rankInterval: [1, 1], ranked: true, reason: null, … }
 */
export function computeScorecards(polls: readonly ScorecardPoll[], settings: ScorecardSettings): Scorecards {
  validate(polls, settings);
  const { minPolls, seed, draws } = settings;

  const firmOrder: PollsterId[] = [];
  const byFirm = new Map<PollsterId, ScorecardPoll[]>();
  for (const p of polls) {
    const list = byFirm.get(p.pollster);
    if (list) list.push(p);
    else {
      byFirm.set(p.pollster, [p]);
      firmOrder.push(p.pollster);
    }
  }

  // Excess error and its shrinkage.
  const excess = contestAdjustedExcess(polls);
  const excessFirms = excess.firms.filter((f) => f.n > 0);
  const dByFirm = new Map<PollsterId, number[]>();
  for (const d of excess.polls) {
    const list = dByFirm.get(d.pollster);
    if (list) list.push(d.excess);
    else dByFirm.set(d.pollster, [d.excess]);
  }
  const shrink =
    excessFirms.length > 0
      ? shrinkFirmMeans(
          excessFirms.map((f) => {
            const ds = dByFirm.get(f.pollster) as number[];
            return { mean: f.mean as number, n: f.n, ss: sumNthPowerDeviations(ds, 2) };
          }),
          0,
        )
      : null;
  const shrunkBy = new Map(excessFirms.map((f, i) => [f.pollster, shrink?.firms[i]] as const));
  const excessBy = new Map(excess.firms.map((f) => [f.pollster, f] as const));

  // Who is ranked, and the point ranks.
  const rankedIds = firmOrder.filter(
    (id) => (byFirm.get(id) as ScorecardPoll[]).length >= minPolls && (excessBy.get(id)?.n ?? 0) > 0,
  );
  const pointRanks = rankedIds.length > 0
    ? averageRanks(rankedIds.map((id) => (shrunkBy.get(id) as { shrunk: number }).shrunk))
    : [];
  const rankBy = new Map(rankedIds.map((id, i) => [id, pointRanks[i] as number] as const));

  // Bootstrap (only when some contest has rival polls).
  let boot: BootstrapRanksResult | null = null;
  if (excess.polls.length > 0) {
    boot = bootstrapRanks(polls, { seed, draws, level: LEVEL, statistic: 'shrunk', rankAmong: rankedIds });
  }
  const bootBy = new Map((boot?.firms ?? []).map((f) => [f.pollster, f] as const));

  const items = firmOrder.map((id): ScorecardItem => {
    const own = byFirm.get(id) as ScorecardPoll[];
    const contests = new Set(own.map((p) => p.contestKey));
    const signed = own.map((p) => p.signedError);
    let interval: Interval | null = null;
    let note: string | null = null;
    if (contests.size >= 2) {
      interval = clusteredMean(signed, own.map((p) => p.contestKey), LEVEL).interval;
    } else {
      note = 'fewer than 2 contests: no interval clustered by contest';
    }
    const calls = rate(own.map((p) => p.winnerCalled));
    const cover = rate(own.map((p) => p.marginCovered));
    const shareCover = rate(own.map((p) => p.shareCovered));
    const disclosures = own.map((p) => p.disclosure).filter((d): d is number => d !== null);
    const ex = excessBy.get(id);
    const sh = shrunkBy.get(id);
    const bt = bootBy.get(id);
    const ranked = rankBy.has(id);
    let reason: string | null = null;
    if (!ranked) {
      reason =
        own.length < minPolls
          ? `fewer polls than the minimum (${own.length} < ${minPolls})`
          : 'no contest also polled by another firm: excess error not computable';
    }
    return {
      pollsterId: id,
      pollster: (own[0] as ScorecardPoll).pollsterName,
      polls: own.length,
      contests: contests.size,
      elections: new Set(own.map((p) => p.electionKey)).size,
      meanAbsMarginError: mean(own.map((p) => p.absMarginError)),
      meanSignedError: mean(signed),
      meanSignedErrorInterval: interval,
      meanSignedErrorNote: note,
      rmse: rootMeanSquare(own.map((p) => p.absMarginError)),
      winnerCalledRate: calls.rate,
      calls: calls.n,
      callsCorrect: calls.yes,
      noCalls: own.length - calls.n,
      coverageRate: cover.rate,
      coverageN: cover.n,
      shareCoverageRate: shareCover.rate,
      shareCoverageN: shareCover.n,
      disclosure: disclosures.length > 0 ? mean(disclosures) : null,
      disclosureN: disclosures.length,
      excessError: ex?.mean ?? null,
      excessErrorN: ex?.n ?? 0,
      excessErrorContests: ex?.contests ?? 0,
      excessErrorShrunk: sh?.shrunk ?? null,
      shrinkageFactor: sh?.B ?? null,
      excessErrorPosteriorSd: sh?.posteriorSd ?? null,
      excessErrorInterval: bt?.excessInterval ?? null,
      excessErrorShrunkInterval: bt?.shrunkInterval ?? null,
      rank: rankBy.get(id) ?? null,
      rankInterval: ranked ? (bt?.rankInterval ?? null) : null,
      pRankFirst: ranked ? (bt?.pRankFirst ?? null) : null,
      pSoleFirst: ranked ? (bt?.pSoleFirst ?? null) : null,
      ranked,
      reason,
    };
  });

  const byNameThenId = (a: ScorecardItem, b: ScorecardItem): number =>
    a.pollster < b.pollster ? -1 : a.pollster > b.pollster ? 1 : String(a.pollsterId) < String(b.pollsterId) ? -1 : 1;
  items.sort((a, b) => {
    if (a.ranked !== b.ranked) return a.ranked ? -1 : 1;
    if (a.ranked && a.rank !== b.rank) return (a.rank as number) - (b.rank as number);
    return byNameThenId(a, b);
  });

  const all = rate(polls.map((p) => p.winnerCalled));
  return {
    items,
    field: {
      polls: polls.length,
      pollsters: firmOrder.length,
      contests: new Set(polls.map((p) => p.contestKey)).size,
      elections: new Set(polls.map((p) => p.electionKey)).size,
      fieldMeanAbsMarginError: mean(polls.map((p) => p.absMarginError)),
      fieldMeanSignedError: mean(polls.map((p) => p.signedError)),
      fieldRmse: rootMeanSquare(polls.map((p) => p.absMarginError)),
      fieldWinnerCalledRate: all.rate,
      fieldCoverageRate: rate(polls.map((p) => p.marginCovered)).rate,
      fieldShareCoverageRate: rate(polls.map((p) => p.shareCovered)).rate,
      ranked: rankedIds.length,
      minPolls,
      seed,
      draws,
      level: LEVEL,
      nominalCoverage: 0.95,
      bootstrapContests: boot?.contests ?? 0,
      excessDroppedPolls: excess.droppedPolls,
      shrinkage: {
        applied: shrink?.applied ?? false,
        note: shrink ? shrink.note : 'no contest polled by 2 firms: no excess error',
        sigma2: shrink?.sigma2 ?? null,
        tau2: shrink?.tau2 ?? null,
        mu: 0,
      },
      rankedBy: 'excessErrorShrunk ascending',
    },
  };
}
