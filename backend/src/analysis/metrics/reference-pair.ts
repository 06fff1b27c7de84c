/**
 * The contest's reference pair (A, B) and its certified shares (SPEC §4, METHODS §0).
 */
import { sum } from 'simple-statistics';
import { MetricInputError, requireFinite } from '../errors';
import { UNDECIDED } from './shares';

/** One option of a contest with its certified votes. */
export interface ContestOption {
  /** Option key, unique in the contest; `undecided` is reserved for polls and refused here. */
  readonly key: string;
  /** Bloc label shared across contests, or null for options of no bloc (independents, `other`). */
  readonly bloc: string | null;
  /** Certified votes, a finite number ≥ 0. */
  readonly votes: number;
}

/** What {@link referencePair} needs to know about a contest. */
export interface ContestInput {
  readonly options: readonly ContestOption[];
  /** The election's orientation blocs [A, B], or null when none are set. */
  readonly orientation: readonly [string, string] | null;
}

/** How the reference pair was chosen. */
export type ReferenceBasis = 'blocs' | 'top_two';

/** The reference pair and the certified top two of a contest. */
export interface ReferencePair {
  /** Option key of A: orientation bloc A's option, else the certified winner. */
  refA: string;
  /** Option key of B: orientation bloc B's option, else the certified runner-up. */
  refB: string;
  basis: ReferenceBasis;
  /** Certified winner (most votes; ties broken by key). */
  winner: string;
  /** Certified runner-up (second most votes; ties broken by key). */
  runnerUp: string;
}

function compareKeys(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

/**
 * Order of options by certified votes, most first. Equal votes are broken by
 * option key in ascending code-unit order (`'A' < 'B' < 'a'`), so the same data
 * always give the same pair. A real certified tie is settled by lot or recount,
 * which the results file does not record; the key order is only a convention.
 */
function byVotesThenKey(a: ContestOption, b: ContestOption): number {
  return b.votes - a.votes || compareKeys(a.key, b.key);
}

function requireOptions(options: readonly ContestOption[]): void {
  if (!Array.isArray(options) || options.length < 2) {
    throw new MetricInputError('options', 'must hold at least 2 options');
  }
  const seen = new Set<string>();
  options.forEach((o, i) => {
    if (o === null || typeof o !== 'object') throw new MetricInputError(`options[${i}]`, 'must be an option object');
    if (typeof o.key !== 'string' || o.key === '') {
      throw new MetricInputError(`options[${i}].key`, 'must be a non-empty string');
    }
    if (o.key === UNDECIDED) {
      throw new MetricInputError(`options[${i}].key`, `must not be the reserved poll key "${UNDECIDED}"`);
    }
    if (seen.has(o.key)) throw new MetricInputError(`options[${i}].key`, `must be unique ("${o.key}" repeats)`);
    seen.add(o.key);
    if (o.bloc !== null && (typeof o.bloc !== 'string' || o.bloc === '')) {
      throw new MetricInputError(`options[${i}].bloc`, 'must be null or a non-empty string');
    }
    requireFinite(`options[${i}].votes`, o.votes);
    if (o.votes < 0) throw new MetricInputError(`options[${i}].votes`, 'must be 0 or more');
  });
  if (!(sum(options.map((o) => o.votes)) > 0)) {
    throw new MetricInputError('options', 'must have a positive total of certified votes');
  }
}

/**
 * Certified shares: each option's votes over the sum of all options' votes in
 * the contest, in points (0–100). The sum uses simple-statistics' compensated
 * `sum`; its denominator is checked to be positive.
 *
 * @param options - at least 2 options with unique keys and votes ≥ 0, total > 0.
 * @throws {MetricInputError} `options`, `options[i].key`, `options[i].bloc` or `options[i].votes`.
 * @returns a new record key → share in points, summing to 100.
 * @example certifiedShares([{ key: 'A', bloc: null, votes: 600 }, { key: 'B', bloc: null, votes: 400 }])
 * // => { A: 60, B: 40 }
 */
export function certifiedShares(options: readonly ContestOption[]): Record<string, number> {
  requireOptions(options);
  const total = sum(options.map((o) => o.votes));
  const out: Record<string, number> = {};
  for (const o of options) out[o.key] = (100 * o.votes) / total;
  return out;
}

/**
 * The reference pair (A, B) of a contest (SPEC §4).
 *
 * When both orientation blocs stand in the contest (some option carries each
 * bloc), A and B are those options; when several options share a bloc, the one
 * with the most certified votes represents it. Otherwise A and B are the
 * certified top two with A the winner. Ties in votes are broken by option key
 * in ascending code-unit order (`'A' < 'B' < 'a'`): a convention that makes the
 * same data always give the same pair, since the results file does not record
 * how a real tie was settled. The certified top two (`winner`, `runnerUp`) are
 * returned in both cases, for winner-called and Mosteller's measure 5.
 *
 * @param contest - options (see {@link certifiedShares}) and the orientation
 *   blocs, null or two different non-empty strings.
 * @throws {MetricInputError} `options…` as in {@link certifiedShares}; `orientation`
 *   when it is not null or a pair of different non-empty strings.
 * @returns `{ refA, refB, basis, winner, runnerUp }`, refA ≠ refB.
 * @example referencePair({ orientation: ['L', 'R'], options: [
 *   { key: 'x', bloc: 'R', votes: 520 }, { key: 'y', bloc: 'L', votes: 480 }] })
 * // => { refA: 'y', refB: 'x', basis: 'blocs', winner: 'x', runnerUp: 'y' }
 */
export function referencePair(contest: ContestInput): ReferencePair {
  if (contest === null || typeof contest !== 'object') throw new MetricInputError('contest', 'must be an object');
  requireOptions(contest.options);
  const { orientation } = contest;
  if (orientation !== null) {
    if (
      !Array.isArray(orientation) ||
      orientation.length !== 2 ||
      orientation.some((b) => typeof b !== 'string' || b === '') ||
      orientation[0] === orientation[1]
    ) {
      throw new MetricInputError('orientation', 'must be null or two different non-empty bloc labels');
    }
  }
  const ranked = [...contest.options].sort(byVotesThenKey);
  const [first, second] = ranked;
  if (first === undefined || second === undefined) throw new MetricInputError('options', 'must hold at least 2 options');
  const top = { winner: first.key, runnerUp: second.key };
  if (orientation !== null) {
    const a = ranked.find((o) => o.bloc === orientation[0]);
    const b = ranked.find((o) => o.bloc === orientation[1]);
    if (a !== undefined && b !== undefined) return { refA: a.key, refB: b.key, basis: 'blocs', ...top };
  }
  return { refA: first.key, refB: second.key, basis: 'top_two', ...top };
}
