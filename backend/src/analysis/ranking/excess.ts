/**
 * Contest-adjusted excess error (METHODS §7).
 */
import { mean } from 'simple-statistics';
import type { ExcessPoll, PollsterId } from './types';
import { requireArray, requireKey, requireNonNegative, requirePollsterId } from './validate';

/** One poll's excess d_j (only polls of contests that another firm also polled). */
export interface PollExcess {
  /** Position of the poll in the input array. */
  readonly index: number;
  readonly pollster: PollsterId;
  readonly contestKey: string;
  /** d_j in points: |e_j| minus the mean |e| of the other firms' polls of the contest. */
  readonly excess: number;
  /** How many polls by other firms the comparison mean averaged. */
  readonly comparedWith: number;
}

/** One firm's contest-adjusted excess error. */
export interface FirmExcess {
  readonly pollster: PollsterId;
  /** All polls of the firm in the input. */
  readonly polls: number;
  /** Polls that have a d_j (their contest was also polled by another firm). */
  readonly n: number;
  /** Distinct contests behind those n polls. */
  readonly contests: number;
  /** Mean of the firm's d_j in points; null when n = 0. Negative = smaller misses than rivals. */
  readonly mean: number | null;
}

export interface ContestAdjustedExcess {
  /** Per-poll d_j, in input order, for the polls that have one. */
  readonly polls: readonly PollExcess[];
  /** Per firm, in order of first appearance in the input. */
  readonly firms: readonly FirmExcess[];
  /** Polls without a d_j (no other firm polled their contest). */
  readonly droppedPolls: number;
}

/**
 * Contest-adjusted excess error: how much larger a firm's misses were than the
 * misses of the other firms polling the same contests.
 *
 * For poll j of firm f in contest c:
 *   d_j = |e_j| − mean{ |e_k| : polls k of contest c by firms other than f }   (points)
 * and the firm's score is the plain mean of its d_j. The comparison mean is over
 * POLLS (a rival with two polls of the contest counts twice). Subtracting the
 * rivals' miss removes the contest's shared difficulty b_c (a fixed-effects
 * adjustment, METHODS §7 [practice]), so firms that polled hard contests are not
 * penalised for it. Contests that no other firm polled give no comparison: their
 * polls drop out (counted in `droppedPolls`); a firm with no d_j gets mean null.
 * Sign: negative d = the poll missed by less than its rivals (better).
 * When every firm has one poll per contest, the d_j of a contest sum to zero,
 * so the poll-weighted mean of all d_j is exactly 0.
 *
 * @param polls at least one poll; `absMarginError` finite and >= 0 (points); not mutated.
 * @throws MetricInputError `polls` (not an array or empty), `polls[i].pollster`,
 *   `polls[i].contestKey`, `polls[i].absMarginError`.
 * @returns per-poll d_j and per-firm means with counts.
 * @example
 * contestAdjustedExcess([
 *   { pollster: 'F1', contestKey: 'c1', absMarginError: 1 },
 *   { pollster: 'F2', contestKey: 'c1', absMarginError: 3 },
 *   { pollster: 'F2', contestKey: 'c2', absMarginError: 2 },
 * ]).firms;
 * // → [ { pollster: 'F1', polls: 1, n: 1, contests: 1, mean: -2 },
 * //     { pollster: 'F2', polls: 2, n: 1, contests: 1, mean: 2 } ]
 */
export function contestAdjustedExcess(polls: readonly ExcessPoll[]): ContestAdjustedExcess {
  requireArray('polls', polls, 1);
  polls.forEach((p, i) => {
    const pollsterOk = typeof p.pollster === 'string' ? p.pollster.length > 0 : Number.isFinite(p.pollster);
    if (pollsterOk && typeof p.contestKey === 'string' && p.contestKey.length > 0 && Number.isFinite(p.absMarginError) && p.absMarginError >= 0) return; // names are built only on failure
    requirePollsterId(`polls[${i}].pollster`, p.pollster);
    requireKey(`polls[${i}].contestKey`, p.contestKey);
    requireNonNegative(`polls[${i}].absMarginError`, p.absMarginError);
  });

  const byContest = new Map<string, number[]>();
  polls.forEach((p, i) => {
    const list = byContest.get(p.contestKey);
    if (list) list.push(i);
    else byContest.set(p.contestKey, [i]);
  });

  const dByPoll = new Map<number, PollExcess>();
  for (const [contestKey, members] of byContest) {
    for (const j of members) {
      const own = polls[j] as ExcessPoll;
      const others = members
        .filter((k) => (polls[k] as ExcessPoll).pollster !== own.pollster)
        .map((k) => (polls[k] as ExcessPoll).absMarginError);
      if (others.length === 0) continue;
      dByPoll.set(j, {
        index: j,
        pollster: own.pollster,
        contestKey,
        excess: own.absMarginError - mean(others),
        comparedWith: others.length,
      });
    }
  }

  const pollExcess = [...dByPoll.values()].sort((a, b) => a.index - b.index);
  const firmOrder: PollsterId[] = [];
  const firmPolls = new Map<PollsterId, number>();
  for (const p of polls) {
    if (!firmPolls.has(p.pollster)) firmOrder.push(p.pollster);
    firmPolls.set(p.pollster, (firmPolls.get(p.pollster) ?? 0) + 1);
  }
  const firms = firmOrder.map((pollster): FirmExcess => {
    const own = pollExcess.filter((d) => d.pollster === pollster);
    return {
      pollster,
      polls: firmPolls.get(pollster) ?? 0,
      n: own.length,
      contests: new Set(own.map((d) => d.contestKey)).size,
      mean: own.length > 0 ? mean(own.map((d) => d.excess)) : null,
    };
  });
  return { polls: pollExcess, firms, droppedPolls: polls.length - pollExcess.length };
}
