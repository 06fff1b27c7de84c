/**
 * Seeded bootstrap of firm rankings (METHODS §7).
 *
 * Conventions shared by both bootstraps below:
 * - Randomness: seedrandom 3.0.5 (ARC4) seeded with `String(seed)`; resample
 *   index = ⌊u·m⌋ with u in [0, 1). Same seed and inputs → identical output.
 *   Numbers and strings that print alike are the same seed (1 ≡ '1').
 * - Ranks: `averageRanks` per draw, rank 1 = smallest statistic (fewest misses).
 * - `pRankFirst`: each draw gives one unit of "first place"; m firms tied for the
 *   smallest statistic get 1/m each. Divided by ALL draws, so the values over the
 *   ranked firms sum to 1.
 * - `pSoleFirst`: share of all draws in which the firm alone had the smallest
 *   statistic, i.e. its average rank was exactly 1 (ties at the top count 0).
 *   This is the quantity of the METHODS §7 exact-enumeration check (0.456993);
 *   it differs from `pRankFirst` only by ties.
 * - `rankInterval`: percentiles (1 − level)/2 and (1 + level)/2 of the firm's
 *   ranks, inverted-CDF definition (numpy `method='inverted_cdf'`, Hyndman–Fan
 *   type 1), so the ends are ranks that occurred. Statistic intervals use linear
 *   interpolation (type 7, numpy's default). See `percentiles.ts`.
 */
import seedrandom from 'seedrandom';
import { sum } from 'simple-statistics';
import { MetricInputError, requireFinite } from '../errors';
import { contestAdjustedExcess } from './excess';
import { intervalOfSorted } from './percentiles';
import { averageRanks } from './ranks';
import { shrinkFirmMeans } from './shrinkage';
import type { ExcessPoll, Interval, PollsterId } from './types';
import { requireArray, requireInteger, requireLevel, requirePollsterId, requireSeed } from './validate';

/** Default number of bootstrap draws. */
export const DEFAULT_DRAWS = 1000;

/** Tallies ranks and first places of k competitors over bootstrap draws. */
class RankTally {
  readonly ranks: number[][];
  readonly firstCredit: number[];
  readonly soleFirst: number[];
  constructor(k: number) {
    this.ranks = Array.from({ length: k }, () => []);
    this.firstCredit = new Array<number>(k).fill(0);
    this.soleFirst = new Array<number>(k).fill(0);
  }
  /** Records one draw: competitors `who` (indices) with statistics `stats`. */
  add(who: readonly number[], stats: readonly number[]): void {
    if (who.length === 0) return;
    const r = averageRanks(stats);
    const best = Math.min(...stats);
    const tied = stats.filter((s) => s === best).length;
    who.forEach((w, i) => {
      (this.ranks[w] as number[]).push(r[i] as number);
      if (stats[i] === best) this.firstCredit[w] = (this.firstCredit[w] as number) + 1 / tied;
      if (r[i] === 1) this.soleFirst[w] = (this.soleFirst[w] as number) + 1;
    });
  }
  summary(w: number, draws: number, level: number) {
    const ranks = [...(this.ranks[w] as number[])].sort((a, b) => a - b);
    return {
      pRankFirst: (this.firstCredit[w] as number) / draws,
      pSoleFirst: (this.soleFirst[w] as number) / draws,
      meanRank: ranks.length > 0 ? sum(ranks) / ranks.length : null,
      rankInterval: ranks.length > 0 ? intervalOfSorted(ranks, level, 'inverted_cdf') : null,
    };
  }
}

/**
 * One draw's sums per firm over the contests drawn (multiplicity m > 0): n += m·k, total +=
 * m·Σd, squares += m·Σd² (the firm arrays are zeroed first). A small function of its own, so that
 * the engine compiles this hot loop on its own.
 */
function accumulateDraw(
  multiplicity: Int32Array, entryFrom: Int32Array, entryFirm: Int32Array, entryN: Int32Array, entryTotal: Float64Array, entrySquares: Float64Array,
  firmN: Float64Array, firmTotal: Float64Array, firmSquares: Float64Array,
): void {
  firmN.fill(0);
  firmTotal.fill(0);
  firmSquares.fill(0);
  const G = multiplicity.length;
  for (let c = 0; c < G; c += 1) {
    const m = multiplicity[c]!;
    if (m === 0) continue;
    const to = entryFrom[c + 1]!;
    for (let x = entryFrom[c]!; x < to; x += 1) {
      const fi = entryFirm[x]!;
      firmN[fi]! += m * entryN[x]!;
      firmTotal[fi]! += m * entryTotal[x]!;
      firmSquares[fi]! += m * entrySquares[x]!;
    }
  }
}

function sortedInterval(values: number[], level: number): Interval | null {
  if (values.length === 0) return null;
  return intervalOfSorted([...values].sort((a, b) => a - b), level, 'linear');
}

function checkCommon(options: { seed: unknown; draws?: number; level?: number } | undefined): {
  seed: number | string;
  draws: number;
  level: number;
} {
  if (typeof options !== 'object' || options === null) {
    throw new MetricInputError('options', 'must be an object with a seed');
  }
  requireSeed('options.seed', options.seed);
  const draws = options.draws ?? DEFAULT_DRAWS;
  requireInteger('options.draws', draws, 1);
  const level = options.level ?? 0.95;
  requireLevel('options.level', level);
  return { seed: options.seed, draws, level };
}

export interface BootstrapRanksOptions {
  /** Seed of the PRNG (required: results must be reproducible). */
  readonly seed: number | string;
  /** Number of draws, a positive integer; default 1000. */
  readonly draws?: number;
  /** Interval level; default 0.95. */
  readonly level?: number;
  /**
   * What is ranked in each draw: 'excess' (default) = the firm's contest-adjusted
   * excess error; 'shrunk' = that value after `shrinkFirmMeans` re-estimated
   * σ², τ² in the draw (what scorecards rank by).
   */
  readonly statistic?: 'excess' | 'shrunk';
  /** Firms to rank (default: every firm with an excess error). Others still count as rivals. */
  readonly rankAmong?: readonly PollsterId[];
  /** Shrinkage target μ for statistic 'shrunk'; default 0. */
  readonly shrinkTarget?: number;
}

export interface FirmRankBootstrap {
  readonly pollster: PollsterId;
  /** Whether the firm is among those ranked. */
  readonly ranked: boolean;
  /** Draws in which the firm had at least one poll (its statistic existed). */
  readonly drawsPresent: number;
  /** Ranked firms only (else null); see the module notes. */
  readonly rankInterval: Interval | null;
  readonly pRankFirst: number | null;
  readonly pSoleFirst: number | null;
  /** Mean rank over the draws where present (ranked firms only). */
  readonly meanRank: number | null;
  /** Percentile interval (type 7) of the firm's excess error over the draws where present. */
  readonly excessInterval: Interval | null;
  /** Same for the shrunk excess error (statistic 'shrunk' only, else null). */
  readonly shrunkInterval: Interval | null;
}

export interface BootstrapRanksResult {
  readonly seed: number | string;
  readonly draws: number;
  readonly level: number;
  readonly statistic: 'excess' | 'shrunk';
  /** Resampling units: contests polled by at least 2 firms. */
  readonly contests: number;
  /** Every firm with an excess error, in order of first appearance in `polls`. */
  readonly firms: readonly FirmRankBootstrap[];
}

/**
 * Bootstrap rank intervals for firms ranked by contest-adjusted excess error,
 * resampling CONTESTS with replacement (polls of a contest share its error b_c,
 * so the contest is the independent unit; METHODS §7, Goldstein & Spiegelhalter
 * 1996, *JRSS A* 159:385–443).
 *
 * Each draw picks G contests with replacement from the G contests that at least
 * two firms polled (the only ones carrying a d_j). A contest drawn m times enters
 * m times with all its polls. Because d_j depends only on the polls of its own
 * contest, the recomputed firm statistic is the mean of the firm's d_j weighted by
 * the multiplicities — the same as recomputing `contestAdjustedExcess` on the
 * resampled data. A firm with no poll in a draw has no statistic there: it is
 * left out of that draw's ranking (the others are ranked among those present),
 * and its intervals use only the draws where it was present (`drawsPresent`).
 *
 * @param polls polls as for `contestAdjustedExcess`; not mutated.
 * @param options seed (required), draws (default 1000), level (0.95),
 *   statistic ('excess'), rankAmong, shrinkTarget (0).
 * @throws MetricInputError everything `contestAdjustedExcess` throws; `polls` when
 *   no contest was polled by 2 firms; `options`, `options.seed`, `options.draws`,
 *   `options.level`, `options.statistic`, `options.rankAmong[i]` (not a firm with an
 *   excess error, or listed twice), `options.shrinkTarget`.
 * @returns per firm: rank interval, P(rank 1) (fractional and sole), excess interval.
 * @example
 * // c1: F1 |e| 0, F2 4 (d = −4, +4); c2: F1 3, F2 1 (d = +2, −2). Exact P(F1 first) = 3/4.
 * bootstrapRanks([
 *   { pollster: 'F1', contestKey: 'c1', absMarginError: 0 }, { pollster: 'F2', contestKey: 'c1', absMarginError: 4 },
 *   { pollster: 'F1', contestKey: 'c2', absMarginError: 3 }, { pollster: 'F2', contestKey: 'c2', absMarginError: 1 },
 * ], { seed: 42 }).firms[0];
 * // → { pollster: 'F1', ranked: true, drawsPresent: 1000, rankInterval: [1, 2], pRankFirst: 0.725,
 * //     pSoleFirst: 0.725, meanRank: 1.275, excessInterval: [-4, 2], shrunkInterval: null }
 */
export function bootstrapRanks(
  polls: readonly ExcessPoll[],
  options: BootstrapRanksOptions,
): BootstrapRanksResult {
  const excess = contestAdjustedExcess(polls);
  const { seed, draws, level } = checkCommon(options);
  const statistic = options.statistic ?? 'excess';
  if (statistic !== 'excess' && statistic !== 'shrunk') {
    throw new MetricInputError('options.statistic', "must be 'excess' or 'shrunk'");
  }
  const mu = options.shrinkTarget ?? 0;
  requireFinite('options.shrinkTarget', mu);
  if (excess.polls.length === 0) {
    throw new MetricInputError('polls', 'must include a contest polled by at least 2 firms');
  }

  const firms = excess.firms.filter((f) => f.n > 0).map((f) => f.pollster);
  const firmIndex = new Map(firms.map((id, i) => [id, i] as const));
  let rankedSet: Set<PollsterId>;
  if (options.rankAmong === undefined) rankedSet = new Set(firms);
  else {
    requireArray('options.rankAmong', options.rankAmong, 0);
    rankedSet = new Set();
    options.rankAmong.forEach((id, i) => {
      requirePollsterId(`options.rankAmong[${i}]`, id);
      if (!firmIndex.has(id) || rankedSet.has(id)) {
        throw new MetricInputError(
          `options.rankAmong[${i}]`,
          'must name, once, a pollster that has an excess error',
        );
      }
      rankedSet.add(id);
    });
  }

  // Contest → per firm the d_j values of that firm's polls there.
  const contestKeys: string[] = [];
  const contestIndex = new Map<string, number>();
  for (const d of excess.polls) {
    if (!contestIndex.has(d.contestKey)) {
      contestIndex.set(d.contestKey, contestKeys.length);
      contestKeys.push(d.contestKey);
    }
  }
  const entries: { contest: number; ds: number[]; total: number }[][] = firms.map(() => []);
  for (const d of excess.polls) {
    const fi = firmIndex.get(d.pollster) as number;
    const c = contestIndex.get(d.contestKey) as number;
    const list = entries[fi] as { contest: number; ds: number[]; total: number }[];
    const hit = list.find((e) => e.contest === c);
    if (hit) hit.ds.push(d.excess);
    else list.push({ contest: c, ds: [d.excess], total: 0 });
  }
  for (const list of entries) for (const e of list) e.total = sum(e.ds);

  // The same entries by contest (contest c's are entryFrom[c] … entryFrom[c + 1] − 1), each with
  // its firm, its number of d_j values, their sum and their sum of squares: a draw visits only the
  // contests it drew.
  const G = contestKeys.length;
  const perContest = new Int32Array(G + 1);
  let entryCount = 0;
  for (const list of entries) {
    for (const entry of list) perContest[entry.contest + 1] = (perContest[entry.contest + 1] as number) + 1;
    entryCount += list.length;
  }
  for (let c = 0; c < G; c += 1) perContest[c + 1] = (perContest[c + 1] as number) + (perContest[c] as number);
  const entryFrom = perContest.slice();
  const fill = perContest.slice(0, G);
  const entryFirm = new Int32Array(entryCount);
  const entryN = new Int32Array(entryCount);
  const entryTotal = new Float64Array(entryCount);
  const entrySquares = new Float64Array(entryCount);
  entries.forEach((list, fi) => {
    for (const entry of list) {
      const e = fill[entry.contest] as number;
      fill[entry.contest] = e + 1;
      entryFirm[e] = fi;
      entryN[e] = entry.ds.length;
      entryTotal[e] = entry.total;
      let q = 0;
      for (const d of entry.ds) q += d * d;
      entrySquares[e] = q;
    }
  });

  const rng = seedrandom(String(seed));
  const multiplicity = new Int32Array(G);
  const firmN = new Float64Array(firms.length);
  const firmTotal = new Float64Array(firms.length);
  const firmSquares = new Float64Array(firms.length);
  const tally = new RankTally(firms.length);
  const excessDraws: number[][] = firms.map(() => []);
  const shrunkDraws: number[][] = firms.map(() => []);
  const rankedIdx = firms.map((id) => rankedSet.has(id));

  for (let b = 0; b < draws; b += 1) {
    multiplicity.fill(0);
    for (let i = 0; i < G; i += 1) {
      const c = Math.floor(rng() * G);
      multiplicity[c] = (multiplicity[c] as number) + 1;
    }
    // Per firm: n, Σ m·total and Σ m·Σd² over the drawn contests; then
    // ss = Σ m·Σ(d − mean)² = Σ m·Σd² − total·mean.
    accumulateDraw(multiplicity, entryFrom, entryFirm, entryN, entryTotal, entrySquares, firmN, firmTotal, firmSquares);
    const present: number[] = [];
    const summaries: { mean: number; n: number; ss: number }[] = [];
    for (let fi = 0; fi < firms.length; fi += 1) {
      const n = firmN[fi] as number;
      if (n === 0) continue;
      const total = firmTotal[fi] as number;
      const mean = total / n;
      // Rounding can leave a hair below 0 when every value is the same.
      const ss = Math.max(0, (firmSquares[fi] as number) - total * mean);
      present.push(fi);
      summaries.push({ mean, n, ss });
      (excessDraws[fi] as number[]).push(mean);
    }
    let stats = summaries.map((s) => s.mean);
    if (statistic === 'shrunk') {
      stats = shrinkFirmMeans(summaries, mu).firms.map((f) => f.shrunk);
      present.forEach((fi, i) => (shrunkDraws[fi] as number[]).push(stats[i] as number));
    }
    const who: number[] = [];
    const whoStats: number[] = [];
    present.forEach((fi, i) => {
      if (rankedIdx[fi]) {
        who.push(fi);
        whoStats.push(stats[i] as number);
      }
    });
    tally.add(who, whoStats);
  }

  return {
    seed,
    draws,
    level,
    statistic,
    contests: G,
    firms: firms.map((pollster, fi): FirmRankBootstrap => {
      const ranked = rankedIdx[fi] as boolean;
      const s = tally.summary(fi, draws, level);
      return {
        pollster,
        ranked,
        drawsPresent: (excessDraws[fi] as number[]).length,
        rankInterval: ranked ? s.rankInterval : null,
        pRankFirst: ranked ? s.pRankFirst : null,
        pSoleFirst: ranked ? s.pSoleFirst : null,
        meanRank: ranked ? s.meanRank : null,
        excessInterval: sortedInterval(excessDraws[fi] as number[], level),
        shrunkInterval: statistic === 'shrunk' ? sortedInterval(shrunkDraws[fi] as number[], level) : null,
      };
    }),
  };
}

/** One firm's values for `bootstrapWithinFirm`. */
export interface WithinFirmGroup {
  readonly id: PollsterId;
  /** The firm's values (e.g. absolute errors in points), at least one, finite. */
  readonly values: readonly number[];
}

export interface FirmWithinBootstrap {
  readonly id: PollsterId;
  readonly n: number;
  /** Mean of the firm's values in the data. */
  readonly mean: number;
  readonly pRankFirst: number;
  readonly pSoleFirst: number;
  readonly meanRank: number;
  readonly rankInterval: Interval;
  /** Percentile interval (type 7) of the resampled mean. */
  readonly meanInterval: Interval;
}

export interface WithinFirmBootstrapResult {
  readonly seed: number | string;
  readonly draws: number;
  readonly level: number;
  readonly firms: readonly FirmWithinBootstrap[];
}

/**
 * Generic ranking bootstrap that resamples each firm's values WITHIN the firm
 * (n_f values with replacement from its own n_f), ranks the firms by resampled
 * mean (rank 1 = smallest) and tallies ranks. It ignores shared contest error, so
 * it is the textbook case for checking the machinery (METHODS §7 exact
 * enumeration) rather than the scorecards' method, which is `bootstrapRanks`.
 * Per draw the groups are resampled in input order, values in order.
 *
 * @param groups at least one group with distinct ids; not mutated.
 * @param options seed (required), draws (default 1000), level (0.95).
 * @throws MetricInputError `groups`, `groups[g].id` (invalid or repeated),
 *   `groups[g].values` (empty or non-finite), `options`, `options.seed`,
 *   `options.draws`, `options.level`.
 * @example
 * bootstrapWithinFirm([{ id: 'A', values: [1, 2, 4] }, { id: 'B', values: [2, 2.5, 3] },
 *   { id: 'C', values: [0.5, 3.5, 5] }], { seed: 1, draws: 200000 }).firms[0].pSoleFirst;
 * // → 0.457345 (exact over all 19,683 resamples: 0.456993)
 */
export function bootstrapWithinFirm(
  groups: readonly WithinFirmGroup[],
  options: { readonly seed: number | string; readonly draws?: number; readonly level?: number },
): WithinFirmBootstrapResult {
  requireArray('groups', groups, 1);
  const ids = new Set<PollsterId>();
  groups.forEach((g, i) => {
    requirePollsterId(`groups[${i}].id`, g?.id);
    if (ids.has(g.id)) throw new MetricInputError(`groups[${i}].id`, 'must not repeat another group id');
    ids.add(g.id);
    requireArray(`groups[${i}].values`, g.values, 1);
    g.values.forEach((x, j) => requireFinite(`groups[${i}].values[${j}]`, x));
  });
  const { seed, draws, level } = checkCommon(options);
  const rng = seedrandom(String(seed));
  const k = groups.length;
  const tally = new RankTally(k);
  const meanDraws: number[][] = groups.map(() => []);
  const all = groups.map((_, i) => i);
  for (let b = 0; b < draws; b += 1) {
    const stats = groups.map((g, gi) => {
      const n = g.values.length;
      let total = 0;
      for (let i = 0; i < n; i += 1) total += g.values[Math.floor(rng() * n)] as number;
      const m = total / n;
      (meanDraws[gi] as number[]).push(m);
      return m;
    });
    tally.add(all, stats);
  }
  return {
    seed,
    draws,
    level,
    firms: groups.map((g, gi): FirmWithinBootstrap => {
      const s = tally.summary(gi, draws, level);
      return {
        id: g.id,
        n: g.values.length,
        mean: sum(g.values) / g.values.length,
        pRankFirst: s.pRankFirst,
        pSoleFirst: s.pSoleFirst,
        meanRank: s.meanRank as number,
        rankInterval: s.rankInterval as Interval,
        meanInterval: sortedInterval(meanDraws[gi] as number[], level) as Interval,
      };
    }),
  };
}
