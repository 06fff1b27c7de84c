import { describe, expect, it } from 'vitest';
import { contestAdjustedExcess } from './excess';
import { deepFreeze, expectInputError } from './testHelpers';
import type { ExcessPoll } from './types';

const poll = (pollster: string | number, contestKey: string, absMarginError: number): ExcessPoll => ({
  pollster,
  contestKey,
  absMarginError,
});

describe('contestAdjustedExcess', () => {
  it('subtracts the mean |e| of the other firms in the same contest', () => {
    const polls = deepFreeze([
      poll('F1', 'c1', 1),
      poll('F2', 'c1', 4),
      poll('F3', 'c1', 1),
      poll('F4', 'c1', 7),
      poll('F1', 'c2', 1),
      poll('F2', 'c2', 5),
      poll('F4', 'c9', 3),
    ]);
    const r = contestAdjustedExcess(polls);
    // [practice] hand, METHODS §7 definition:
    // c1: F1 1 − (4+1+7)/3 = −3; F2 4 − (1+1+7)/3 = 1; F3 1 − (1+4+7)/3 = −3; F4 7 − (1+4+1)/3 = 5
    // c2: F1 1 − 5 = −4; F2 5 − 1 = 4; c9 has no rival: dropped
    expect(r.polls.map((d) => d.excess)).toEqual([-3, 1, -3, 5, -4, 4]);
    expect(r.polls.map((d) => d.comparedWith)).toEqual([3, 3, 3, 3, 1, 1]);
    expect(r.droppedPolls).toBe(1);
    // [practice] hand: F1 mean (−3 − 4)/2 = −3.5; F2 (1 + 4)/2 = 2.5; F3 −3; F4 5 over 1 of its 2 polls
    expect(r.firms).toEqual([
      { pollster: 'F1', polls: 2, n: 2, contests: 2, mean: -3.5 },
      { pollster: 'F2', polls: 2, n: 2, contests: 2, mean: 2.5 },
      { pollster: 'F3', polls: 1, n: 1, contests: 1, mean: -3 },
      { pollster: 'F4', polls: 2, n: 1, contests: 1, mean: 5 },
    ]);
  });

  it('averages over the rivals\u2019 POLLS and never compares a firm with itself', () => {
    // F2 has two polls of c1 (|e| 2 and 6); F1's comparison mean is (2 + 6)/2 = 4 → d = 1 − 4 = −3.
    // Each F2 poll is compared with F1 only: 2 − 1 = 1 and 6 − 1 = 5 → F2 mean 3 over n = 2, 1 contest.
    const r = contestAdjustedExcess([poll(1, 'c1', 1), poll(2, 'c1', 2), poll(2, 'c1', 6)]);
    expect(r.polls.map((d) => d.excess)).toEqual([-3, 1, 5]); // [practice] hand, above
    expect(r.firms[1]).toEqual({ pollster: 2, polls: 2, n: 2, contests: 1, mean: 3 });
  });

  it('gives null for a firm whose contests nobody else polled, and treats 1 and "1" as different firms', () => {
    const r = contestAdjustedExcess([poll(1, 'a', 2), poll('1', 'a', 3), poll(7, 'b', 1)]);
    // [practice] hand: 1 vs '1' are rivals in contest a: 2 − 3 = −1 and 3 − 2 = 1
    expect(r.firms.map((f) => f.mean)).toEqual([-1, 1, null]);
    expect(r.firms[2]).toEqual({ pollster: 7, polls: 1, n: 0, contests: 0, mean: null });
  });

  it('with one poll per firm and contest, the d_j of each contest sum to 0', () => {
    const abs = [
      [0.4, 2.2, 3.9, 1.1],
      [5.0, 0.1, 2.7],
      [1.3, 1.3],
    ];
    const polls = abs.flatMap((row, c) => row.map((a, f) => poll(`F${f}`, `c${c}`, a)));
    const r = contestAdjustedExcess(polls);
    for (let c = 0; c < abs.length; c += 1) {
      const s = r.polls.filter((d) => d.contestKey === `c${c}`).reduce((a, d) => a + d.excess, 0);
      // [practice] invariant: Σ_f (a_f − (S − a_f)/(k−1)) = S − (kS − S)/(k−1) = 0
      expect(s).toBeCloseTo(0, 12);
    }
  });

  it('shifting every |e| of a contest by a constant leaves the d_j unchanged', () => {
    const base = [poll('A', 'c', 1), poll('B', 'c', 2.5), poll('C', 'c', 4)];
    const shifted = base.map((p) => ({ ...p, absMarginError: p.absMarginError + 10 }));
    const a = contestAdjustedExcess(base).polls.map((d) => d.excess);
    const b = contestAdjustedExcess(shifted).polls.map((d) => d.excess);
    // [practice] invariant: the contest's shared difficulty cancels
    b.forEach((x, i) => expect(x).toBeCloseTo(a[i] as number, 12));
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => contestAdjustedExcess([]), 'polls');
    expectInputError(() => contestAdjustedExcess(null as unknown as ExcessPoll[]), 'polls');
    expectInputError(() => contestAdjustedExcess([poll('', 'c', 1)]), 'polls[0].pollster');
    expectInputError(() => contestAdjustedExcess([poll(Number.NaN, 'c', 1)]), 'polls[0].pollster');
    expectInputError(() => contestAdjustedExcess([poll('A', '', 1)]), 'polls[0].contestKey');
    expectInputError(() => contestAdjustedExcess([poll('A', 'c', 1), poll('B', 'c', -0.5)]), 'polls[1].absMarginError');
    expectInputError(() => contestAdjustedExcess([poll('A', 'c', Number.POSITIVE_INFINITY)]), 'polls[0].absMarginError');
  });
});
