/**
 * Margin error, lean, winner called, two-party share error and per-option
 * share errors (METHODS §1). All shares and errors are in points.
 */
import { MetricInputError, requireFinite } from '../errors';
import { TIE_TOLERANCE_PTS, requirePoints, scoredSet, type Shares } from './shares';

/** Which side of the reference pair a poll overstated. */
export type Lean = 'A' | 'B' | 'none';

/**
 * Signed margin error e = (p_A − p_B) − (V_A − V_B), in points.
 * Positive: the poll overstated A relative to B. Its absolute value is
 * Mosteller's measure 5 when (A, B) are the certified top two.
 *
 * @param pollA - poll share of A, points in [0, 100]; likewise `pollB`.
 * @param resultA - certified share of A, points in [0, 100]; likewise `resultB`.
 * @throws {MetricInputError} naming the argument that is not a share in points.
 * @returns e in points, in [−200, 200].
 * @example signedMarginError(48, 44, 50.2, 47.3) // => 1.1 (to floating-point residue)
 */
export function signedMarginError(pollA: number, pollB: number, resultA: number, resultB: number): number {
  requirePoints('pollA', pollA);
  requirePoints('pollB', pollB);
  requirePoints('resultA', resultA);
  requirePoints('resultB', resultB);
  return pollA - pollB - (resultA - resultB);
}

/**
 * Lean of a signed margin error: `A` if e > 0, `B` if e < 0, `none` if e = 0.
 * |e| below {@link TIE_TOLERANCE_PTS} counts as 0 (floating-point residue).
 *
 * @param marginError - signed margin error in points, finite.
 * @throws {MetricInputError} `marginError` when not finite.
 * @example lean(-1) // => 'B'
 */
export function lean(marginError: number): Lean {
  requireFinite('marginError', marginError);
  if (Math.abs(marginError) < TIE_TOLERANCE_PTS) return 'none';
  return marginError > 0 ? 'A' : 'B';
}

/**
 * Winner called: sign(p_w − p_r) = sign(V_w − V_r), with w, r the certified
 * winner and runner-up. A tie in the poll is "no call" (null), and so is a
 * certified tie, whose winner only the key convention picked. Differences below
 * {@link TIE_TOLERANCE_PTS} count as ties. Only signs matter, so raw and
 * treated shares give the same answer whenever both options survive treatment.
 *
 * @param pollWinner - poll share of the certified winner, points; likewise the others.
 * @throws {MetricInputError} naming the argument that is not a share in points.
 * @returns true (called), false (missed) or null (no call).
 * @example winnerCalled(47, 45, 48.0, 49.5) // => false
 */
export function winnerCalled(
  pollWinner: number,
  pollRunnerUp: number,
  resultWinner: number,
  resultRunnerUp: number,
): boolean | null {
  requirePoints('pollWinner', pollWinner);
  requirePoints('pollRunnerUp', pollRunnerUp);
  requirePoints('resultWinner', resultWinner);
  requirePoints('resultRunnerUp', resultRunnerUp);
  const pollLead = pollWinner - pollRunnerUp;
  const resultLead = resultWinner - resultRunnerUp;
  if (Math.abs(pollLead) < TIE_TOLERANCE_PTS || Math.abs(resultLead) < TIE_TOLERANCE_PTS) return null;
  return Math.sign(pollLead) === Math.sign(resultLead);
}

/**
 * Two-party share error 100·[p_A/(p_A + p_B) − V_A/(V_A + V_B)], in points.
 * The two-party margin error is twice it. Unchanged by every undecided treatment.
 *
 * @param pollA - poll share of A, points; `pollA + pollB` must be > 0.
 * @param resultA - certified share of A, points; `resultA + resultB` must be > 0.
 * @throws {MetricInputError} naming a bad argument, or `pollB`/`resultB` when a pair sums to 0.
 * @returns points in [−100, 100].
 * @example twoPartyShareError(46, 46, 50.5, 49.5) // => -0.5
 */
export function twoPartyShareError(pollA: number, pollB: number, resultA: number, resultB: number): number {
  requirePoints('pollA', pollA);
  requirePoints('pollB', pollB);
  requirePoints('resultA', resultA);
  requirePoints('resultB', resultB);
  if (!(pollA + pollB > 0)) throw new MetricInputError('pollB', 'must make pollA + pollB greater than 0');
  if (!(resultA + resultB > 0)) throw new MetricInputError('resultB', 'must make resultA + resultB greater than 0');
  return 100 * (pollA / (pollA + pollB) - resultA / (resultA + resultB));
}

/**
 * Per-option signed share errors p_i − V_i in points over the scored set
 * (every option but `undecided` with a share on both sides; see `scoredSet`).
 * Positive: the poll overstated the option.
 *
 * @param poll - poll shares in points; never mutated.
 * @param result - certified shares in points; never mutated.
 * @throws {MetricInputError} `poll.<key>`/`result.<key>` for a bad share; `poll`
 *   when no option has a share on both sides.
 * @returns a new record key → error in points, keys in scored-set order.
 * @example shareErrors({ A: 45, B: 41, undecided: 14 }, { A: 49, B: 51 }) // => { B: -10, A: -4 }
 */
export function shareErrors(poll: Shares, result: Shares): Record<string, number> {
  const out: Record<string, number> = {};
  for (const key of scoredSet(poll, result)) out[key] = (poll[key] ?? 0) - (result[key] ?? 0);
  return out;
}
