/**
 * The degenerate-input policy (backend/src/analysis/errors.ts) in every exported
 * function: bad input throws a MetricInputError naming the parameter, never NaN.
 */
import { describe, expect, it } from 'vitest';
import * as metrics from './index';
import { buildContest, buildPoll, expectInputError } from './test-helpers';

const opt = (key: string, bloc: string | null, votes: number) => ({ key, bloc, votes });
const settings = { undecided: 'raw', designEffect: 1 } as const;
type Settings = Parameters<typeof metrics.computePollMetrics>[2];
type Poll = Parameters<typeof metrics.computePollMetrics>[0];
type Contest = Parameters<typeof metrics.computePollMetrics>[1];
/** Smuggles a value of the wrong type past the compiler, as untyped callers could. */
const bad = <T>(value: unknown): T => value as T;

const cases: Record<string, [() => unknown, string][]> = {
  requireShares: [
    [() => metrics.requireShares('s', bad(null)), 's'],
    [() => metrics.requireShares('s', { A: 101 }), 's.A'],
    [() => metrics.requireShares('s', { A: -1 }), 's.A'],
    [() => metrics.requireShares('s', { A: NaN }), 's.A'],
  ],
  requireNonNegativeShares: [
    [() => metrics.requireNonNegativeShares('s', bad([1, 2])), 's'],
    [() => metrics.requireNonNegativeShares('s', { A: -0.1 }), 's.A'],
    [() => metrics.requireNonNegativeShares('s', { A: Infinity }), 's.A'],
  ],
  requirePoints: [
    [() => metrics.requirePoints('x', 100.01), 'x'],
    [() => metrics.requirePoints('x', bad('50')), 'x'],
  ],
  requireShare: [[() => metrics.requireShare('s', { A: 1 }, 'B'), 's.B']],
  requireKey: [[() => metrics.requireKey('k', ''), 'k']],
  scoredSet: [
    [() => metrics.scoredSet({ A: 50, undecided: 50 }, { B: 100 }), 'poll'],
    [() => metrics.scoredSet({ undecided: 10 }, { undecided: 10 }), 'poll'],
    [() => metrics.scoredSet({ A: 50 }, { A: 150 }), 'result.A'],
  ],
  certifiedShares: [
    [() => metrics.certifiedShares([opt('a', null, 1)]), 'options'],
    [() => metrics.certifiedShares([opt('a', null, 0), opt('b', null, 0)]), 'options'],
    [() => metrics.certifiedShares([opt('a', null, 1), opt('a', null, 2)]), 'options[1].key'],
    [() => metrics.certifiedShares([opt('a', null, 1), opt('undecided', null, 2)]), 'options[1].key'],
    [() => metrics.certifiedShares([opt('a', null, -1), opt('b', null, 2)]), 'options[0].votes'],
    [() => metrics.certifiedShares([opt('a', '', 1), opt('b', null, 2)]), 'options[0].bloc'],
    [() => metrics.certifiedShares(bad([opt('a', null, 1), null])), 'options[1]'],
  ],
  referencePair: [
    [() => metrics.referencePair(bad(null)), 'contest'],
    [() => metrics.referencePair({ orientation: null, options: [opt('a', null, NaN), opt('b', null, 2)] }), 'options[0].votes'],
    [() => metrics.referencePair({ orientation: ['L', 'L'], options: [opt('a', 'L', 1), opt('b', null, 2)] }), 'orientation'],
    [() => metrics.referencePair({ orientation: bad(['L']), options: [opt('a', 'L', 1), opt('b', null, 2)] }), 'orientation'],
  ],
  requireTreatment: [[() => metrics.requireTreatment('t', bad('undecided_first')), 't']],
  applyUndecided: [
    [() => metrics.applyUndecided({ A: 50, B: 40 }, bad('none'), 'A', 'B'), 'treatment'],
    [() => metrics.applyUndecided({ A: 50, B: 40 }, 'raw', 'A', 'A'), 'refB'],
    [() => metrics.applyUndecided({ A: 50, B: 40 }, 'raw', '', 'B'), 'refA'],
    [() => metrics.applyUndecided({ A: 50, B: 40 }, 'raw', 'undecided', 'B'), 'refA'],
    [() => metrics.applyUndecided({ A: 0, undecided: 100 }, 'proportional', 'A', 'B'), 'shares.undecided'],
    [() => metrics.applyUndecided({ A: 50 }, 'two_party', 'A', 'B'), 'shares.B'],
    [() => metrics.applyUndecided({ A: 0, B: 0 }, 'two_party', 'A', 'B'), 'shares'],
    [() => metrics.applyUndecided({ A: 50, B: 140 }, 'raw', 'A', 'B'), 'shares.B'],
  ],
  signedMarginError: [
    [() => metrics.signedMarginError(NaN, 40, 50, 45), 'pollA'],
    [() => metrics.signedMarginError(50, -1, 50, 45), 'pollB'],
    [() => metrics.signedMarginError(50, 40, 101, 45), 'resultA'],
    [() => metrics.signedMarginError(50, 40, 50, Infinity), 'resultB'],
  ],
  lean: [[() => metrics.lean(NaN), 'marginError']],
  winnerCalled: [
    [() => metrics.winnerCalled(NaN, 40, 50, 45), 'pollWinner'],
    [() => metrics.winnerCalled(50, 40, 50, -45), 'resultRunnerUp'],
  ],
  twoPartyShareError: [
    [() => metrics.twoPartyShareError(0, 0, 50, 45), 'pollB'],
    [() => metrics.twoPartyShareError(50, 40, 0, 0), 'resultB'],
    [() => metrics.twoPartyShareError(50, 40, 50, 200), 'resultB'],
  ],
  shareErrors: [
    [() => metrics.shareErrors({ A: 50 }, { B: 50 }), 'poll'],
    [() => metrics.shareErrors({ A: 50 }, bad(undefined)), 'result'],
  ],
  mosteller3: [
    [() => metrics.mosteller3({ undecided: 100 }, { A: 50 }), 'poll'],
    [() => metrics.mosteller3({ A: -3 }, { A: 50 }), 'poll.A'],
  ],
  mosteller5: [
    [() => metrics.mosteller5(50, 40, 50, NaN), 'resultRunnerUp'],
    [() => metrics.mosteller5(500, 40, 50, 45), 'pollWinner'],
  ],
  mtkAccuracy: [
    [() => metrics.mtkAccuracy(bad(null)), 'input'],
    [() => metrics.mtkAccuracy({ pollA: 0, pollB: 40, resultA: 50, resultB: 45, n: 1000 }), 'pollA'],
    [() => metrics.mtkAccuracy({ pollA: 44, pollB: 40, resultA: 50, resultB: 0, n: 1000 }), 'resultB'],
    [() => metrics.mtkAccuracy({ pollA: 44, pollB: 40, resultA: 50, resultB: 45, n: 0 }), 'n'],
  ],
  mtkMean: [
    [() => metrics.mtkMean([0.1]), 'values'],
    [() => metrics.mtkMean([0.1, 0.1, 0.1]), 'values'],
    [() => metrics.mtkMean([0.1, NaN]), 'values[1]'],
  ],
  aeAccuracy: [
    [() => metrics.aeAccuracy({ a: 40, undecided: 60 }, { a: 40, b: 60 }, 100), 'poll'],
    [() => metrics.aeAccuracy({ a: 40, b: 0 }, { a: 40, b: 60 }, 100), 'poll.b'],
    [() => metrics.aeAccuracy({ a: 40, b: 60 }, { a: 40 }, 100), 'result.b'],
    [() => metrics.aeAccuracy({ a: 40, b: 60 }, { a: 40, b: 0 }, 100), 'result.b'],
    [() => metrics.aeAccuracy({ a: 40, b: 60 }, { a: 40, b: 60 }, -5), 'n'],
  ],
  mergeEmptyCategories: [
    [() => metrics.mergeEmptyCategories({ a: 40, undecided: 60 }, { a: 40, undecided: 60 }), 'poll.undecided'],
    [() => metrics.mergeEmptyCategories({ a: 40, b: 60 }, { a: 40 }), 'result.b'],
    [() => metrics.mergeEmptyCategories({ a: 40 }, { a: 40, b: 60 }), 'poll.b'],
    [() => metrics.mergeEmptyCategories({ a: -40 }, { a: 40 }), 'poll.a'],
  ],
  shareSe: [
    [() => metrics.shareSe(1.2, 100), 'p'],
    [() => metrics.shareSe(0.5, 0), 'n'],
  ],
  shareMoe: [
    [() => metrics.shareMoe(48, 1000), 'p'],
    [() => metrics.shareMoe(0.48, NaN), 'n'],
  ],
  marginSe: [
    [() => metrics.marginSe(0.6, 0.5, 1000), 'pB'],
    [() => metrics.marginSe(-0.1, 0.5, 1000), 'pA'],
    [() => metrics.marginSe(0.4, 0.5, -1), 'n'],
  ],
  marginMoe: [[() => metrics.marginMoe(0.4, 0.5, 0), 'n']],
  kishDesignEffect: [
    [() => metrics.kishDesignEffect([]), 'weights'],
    [() => metrics.kishDesignEffect([1, 0, 2]), 'weights[1]'],
    [() => metrics.kishDesignEffect([1, NaN]), 'weights[1]'],
  ],
  nEffFromStatedMoe: [
    [() => metrics.nEffFromStatedMoe(0), 'moePts'],
    [() => metrics.nEffFromStatedMoe(150), 'moePts'],
  ],
  wilsonInterval: [
    [() => metrics.wilsonInterval(5, 0), 'n'],
    [() => metrics.wilsonInterval(11, 10), 'x'],
    [() => metrics.wilsonInterval(-1, 10), 'x'],
  ],
  shareCovered: [
    [() => metrics.shareCovered(48, 50, 0), 'nEff'],
    [() => metrics.shareCovered(0.48, 150, 1000), 'resultA'],
  ],
  marginCovered: [
    [() => metrics.marginCovered(60, 50, 50, 45, 1000), 'pollB'],
    [() => metrics.marginCovered(48, 44, 50, 45, -1), 'nEff'],
    [() => metrics.marginCovered(NaN, 44, 50, 45, 1000), 'pollA'],
  ],
  isoDayNumber: [
    [() => metrics.isoDayNumber('d', '2026-02-30'), 'd'],
    [() => metrics.isoDayNumber('d', bad(20260101)), 'd'],
  ],
  daysOut: [
    [() => metrics.daysOut('10/05/2026', '2026-05-01', '2026-05-02'), 'electionDate'],
    [() => metrics.daysOut('2026-05-10', '2026-05-32', '2026-05-02'), 'fieldworkStart'],
    [() => metrics.daysOut('2026-05-10', '2026-05-03', '2026-05-02'), 'fieldworkEnd'],
  ],
  computePollMetrics: [
    [() => metrics.computePollMetrics(bad<Poll>(null), buildContest(), settings), 'poll'],
    [() => metrics.computePollMetrics(buildPoll({ n: 0 }), buildContest(), settings), 'n'],
    [() => metrics.computePollMetrics(buildPoll({ n: 99.5 }), buildContest(), settings), 'n'],
    [() => metrics.computePollMetrics(buildPoll({ moe: -3 }), buildContest(), settings), 'moe'],
    [() => metrics.computePollMetrics(buildPoll({ moe: 120 }), buildContest(), settings), 'moe'],
    [() => metrics.computePollMetrics(buildPoll({ shares: { A: 60, B: 45 } }), buildContest(), settings), 'shares'],
    [() => metrics.computePollMetrics(buildPoll({ shares: { A: 60, B: NaN } }), buildContest(), settings), 'shares.B'],
    [() => metrics.computePollMetrics(buildPoll({ shares: { A: 60 } }), buildContest(), settings), 'shares.B'],
    [() => metrics.computePollMetrics(buildPoll({ fieldworkEnd: '2026-04-01' }), buildContest(), settings), 'fieldworkEnd'],
    [() => metrics.computePollMetrics(buildPoll(), buildContest({ electionDate: '2026-5-10' }), settings), 'electionDate'],
    [() => metrics.computePollMetrics(buildPoll(), buildContest({ options: [opt('A', null, 1)] }), settings), 'options'],
    [() => metrics.computePollMetrics(buildPoll(), bad<Contest>(null), settings), 'contest'],
    [() => metrics.computePollMetrics(buildPoll(), buildContest(), bad<Settings>(null)), 'settings'],
    [() => metrics.computePollMetrics(buildPoll(), buildContest(), { undecided: bad('all'), designEffect: 1 }), 'undecided'],
    [() => metrics.computePollMetrics(buildPoll(), buildContest(), { undecided: 'raw', designEffect: 0 }), 'designEffect'],
    [() => metrics.computePollMetrics(buildPoll({ n: 0 }), metrics.preparePollContest(buildContest()), settings), 'n'],
  ],
  preparePollContest: [
    [() => metrics.preparePollContest(bad<Contest>(null)), 'contest'],
    [() => metrics.preparePollContest(buildContest({ options: [opt('A', null, 1)] })), 'options'],
    [() => metrics.preparePollContest(buildContest({ orientation: bad(['left', 'left']) })), 'orientation'],
  ],
};

describe('every exported function throws MetricInputError naming the parameter', () => {
  for (const [name, list] of Object.entries(cases)) {
    it(name, () => {
      for (const [run, parameter] of list) expectInputError(run, parameter);
    });
  }

  it('covers every exported function', () => {
    const exported = Object.entries(metrics)
      .filter(([, value]) => typeof value === 'function')
      .map(([name]) => name)
      // hasShare is a predicate that never throws (tested below).
      .filter((name) => name !== 'hasShare');
    expect(Object.keys(cases).sort()).toEqual(exported.sort());
  });

  it('hasShare never throws and ignores inherited keys', () => {
    expect(metrics.hasShare(bad(null), 'A')).toBe(false);
    expect(metrics.hasShare({ A: 1 }, 'toString')).toBe(false);
    expect(metrics.hasShare({ A: 1 }, 'A')).toBe(true);
  });
});
