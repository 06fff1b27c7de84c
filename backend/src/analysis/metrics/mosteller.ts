/**
 * Mosteller's measures 3 and 5 (Mosteller et al. 1949, *The Pre-election Polls
 * of 1948*, SSRC; METHODS §2). Points throughout.
 */
import { mean } from 'simple-statistics';
import { requirePoints, scoredSet, type Shares } from './shares';

/** Measure 3 with the set of options it averaged over. */
export interface Mosteller3 {
  /** Mean absolute share error over `scored`, points, ≥ 0. */
  value: number;
  /** The scored set S: options averaged over, largest certified share first. */
  scored: string[];
}

/**
 * Mosteller's measure 3: M3 = (1/|S|)·Σ_{i∈S} |p_i − V_i|, in points.
 *
 * S is every option with a share in the poll and a certified share; `undecided`
 * is never in S. `other` is in S only when both the poll and the certified
 * result carry an `other` share (the result does when the contest lists an
 * option keyed `other`). Pass two-option records to score the top two only.
 * S is returned with the value so that it can be stored and shown.
 *
 * @param poll - poll shares in points (any treatment); never mutated.
 * @param result - certified shares in points; never mutated.
 * @throws {MetricInputError} `poll.<key>`/`result.<key>` for a bad share; `poll`
 *   when S would be empty.
 * @returns `{ value, scored }`; value in [0, 100].
 * @example mosteller3({ D: 49.5, T: 44.5 }, { T: 49.5, D: 45.1 }) // => { value: 4.7, scored: ['T', 'D'] }
 */
export function mosteller3(poll: Shares, result: Shares): Mosteller3 {
  const scored = scoredSet(poll, result);
  const value = mean(scored.map((k) => Math.abs((poll[k] ?? 0) - (result[k] ?? 0))));
  return { value, scored };
}

/**
 * Mosteller's measure 5: M5 = |(p_a − p_b) − (V_a − V_b)|, a and b the
 * certified winner and runner-up, in points. Equals the absolute margin error
 * when the reference pair is the certified top two.
 *
 * @param pollWinner - poll share of the certified winner, points; likewise the others.
 * @throws {MetricInputError} naming the argument that is not a share in points.
 * @returns points in [0, 200].
 * @example mosteller5(44.5, 49.5, 49.5, 45.1) // => 9.4
 */
export function mosteller5(
  pollWinner: number,
  pollRunnerUp: number,
  resultWinner: number,
  resultRunnerUp: number,
): number {
  requirePoints('pollWinner', pollWinner);
  requirePoints('pollRunnerUp', pollRunnerUp);
  requirePoints('resultWinner', resultWinner);
  requirePoints('resultRunnerUp', resultRunnerUp);
  return Math.abs(pollWinner - pollRunnerUp - (resultWinner - resultRunnerUp));
}
