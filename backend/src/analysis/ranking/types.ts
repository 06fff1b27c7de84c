/**
 * Types shared by the ranking modules.
 *
 * A pollster is identified by `PollsterId`: the database id (a number) or any
 * stable string. Identity is strict: `1` and `'1'` are two different firms.
 */
export type PollsterId = string | number;

/** A closed interval `[lo, hi]` with `lo <= hi`. */
export type Interval = readonly [lo: number, hi: number];

/** One poll as the contest-adjusted excess error needs it. */
export interface ExcessPoll {
  /** The firm that published the poll. */
  readonly pollster: PollsterId;
  /** The contest the poll measured; polls of one contest share its error. */
  readonly contestKey: string;
  /** Absolute margin error |e| of the poll, in points (>= 0). */
  readonly absMarginError: number;
}
