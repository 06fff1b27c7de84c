import { describe, expect, it } from 'vitest';
import { computeScorecards, type ScorecardItem, type ScorecardPoll } from './scorecards';
import { deepFreeze, expectInputError } from './testHelpers';

let seq = 0;
function buildPoll(overrides: Partial<ScorecardPoll> & Pick<ScorecardPoll, 'pollster' | 'contestKey'>): ScorecardPoll {
  seq += 1;
  const signed = overrides.signedError ?? 0;
  return {
    pollKey: `p${String(seq).padStart(2, '0')}`,
    pollsterName: `Firm ${overrides.pollster}`,
    electionKey: 'e1',
    signedError: signed,
    absMarginError: Math.abs(signed),
    winnerCalled: true,
    marginCovered: true,
    shareCovered: true,
    disclosure: null,
    ...overrides,
  };
}

/*
 * Hand fixture. |e| by contest (e1: c1–c4; e2: c5–c9):
 *            c1  c2  c3  c4  | c5  c6  c7 c8 c9
 *   F1 Alder  1   1   2   0  |
 *   F2 Birch  4   5   2   4  |
 *   F3 Cedar  1   3   4   2  |
 *   F4 Dune   7              |  3
 *   F5 Elm                   |      2.5
 *   F6 Fir                   |          1  2  3
 * Contest-adjusted excess d_j = |e_j| − mean |e| of the other firms' polls in the contest:
 *   c1: F1 1 − (4+1+7)/3 = −3; F2 4 − (1+1+7)/3 = 1; F3 1 − 12/3 = −3; F4 7 − (1+4+1)/3 = 5
 *   c2: F1 1 − (5+3)/2 = −3; F2 5 − 2 = 3; F3 3 − 3 = 0
 *   c3: F1 2 − 3 = −1; F2 2 − 3 = −1; F3 4 − 2 = 2
 *   c4: F1 0 − 3 = −3; F2 4 − 1 = 3; F3 2 − 2 = 0
 *   c5–c9 have one firm each: 5 polls dropped.
 * Firm means: F1 −10/4 = −2.5; F2 6/4 = 1.5; F3 −1/4 = −0.25; F4 5 (n 1).
 * Within SS: F1 0.25+0.25+2.25+0.25 = 3; F2 0.25+2.25+6.25+2.25 = 11;
 *   F3 7.5625+0.0625+5.0625+0.0625 = 12.75; F4 0 → 26.75 on N − F = 13 − 4 = 9 df:
 *   σ² = 26.75/9 = 107/36 = 2.972222.
 * DerSimonian–Laird with w_f = n_f/σ²: μ_FE = (−10 + 6 − 1 + 5)/13 = 0;
 *   Q = (4·6.25 + 4·2.25 + 4·0.0625 + 25)/σ² = 59.25/σ²; C = (13 − 49/13)/σ² = (120/13)/σ²;
 *   τ² = (59.25 − 3σ²)·13/120 = (151/3)(13/120) = 1963/360 = 5.452778.
 * Shrinkage toward 0: n = 4: σ²/4 = 107/144, B = (107/144)/(107/144 + 1963/360) = 535/4461 = 0.119928;
 *   shrunk = (3926/4461)·ȳ: F1 −2.200179, F2 1.320108, F3 −0.220018;
 *   posterior SD √(3926/4461 · 107/144) = 0.808667.
 *   n = 1 (F4): B = 1070/3033 = 0.352786; shrunk 5·1963/3033 = 3.236070.
 * minPolls 3 → ranked F1, F2, F3 (4 polls each); F4 (2) and F5 (1) too few; F6 has 3 polls but no
 *   contest with a rival. Ranks by shrunk ascending: F1 1, F3 2, F2 3.
 * t quantiles: t_{0.975,1} 12.706205, t_{0.975,2} 4.302653, t_{0.975,3} 3.182446
 *   ([published] Student t tables to 3 decimals; digits [computed] scipy.stats.t.ppf, scipy 1.10.1).
 */
const FIXTURE: readonly ScorecardPoll[] = deepFreeze([
  buildPoll({ pollster: 1, pollsterName: 'Alder Research', contestKey: 'c1', signedError: 1, marginCovered: true, shareCovered: true, disclosure: 0.8 }),
  buildPoll({ pollster: 1, pollsterName: 'Alder Research', contestKey: 'c2', signedError: -1, marginCovered: true, shareCovered: false, disclosure: 0.6 }),
  buildPoll({ pollster: 1, pollsterName: 'Alder Research', contestKey: 'c3', signedError: 2, marginCovered: false, shareCovered: false }),
  buildPoll({ pollster: 1, pollsterName: 'Alder Research', contestKey: 'c4', signedError: 0, marginCovered: null, shareCovered: false, disclosure: 1 }),
  buildPoll({ pollster: 2, pollsterName: 'Birch Polling', contestKey: 'c1', signedError: 4, marginCovered: false, shareCovered: null }),
  buildPoll({ pollster: 2, pollsterName: 'Birch Polling', contestKey: 'c2', signedError: 5, winnerCalled: false, marginCovered: false, shareCovered: null }),
  buildPoll({ pollster: 2, pollsterName: 'Birch Polling', contestKey: 'c3', signedError: -2, winnerCalled: null, marginCovered: false, shareCovered: null }),
  buildPoll({ pollster: 2, pollsterName: 'Birch Polling', contestKey: 'c4', signedError: 4, marginCovered: false, shareCovered: null }),
  buildPoll({ pollster: 3, pollsterName: 'Cedar Surveys', contestKey: 'c1', signedError: -1, disclosure: 0.5 }),
  buildPoll({ pollster: 3, pollsterName: 'Cedar Surveys', contestKey: 'c2', signedError: 3, shareCovered: false, disclosure: 0.5 }),
  buildPoll({ pollster: 3, pollsterName: 'Cedar Surveys', contestKey: 'c3', signedError: 4, winnerCalled: false, disclosure: 0.5 }),
  buildPoll({ pollster: 3, pollsterName: 'Cedar Surveys', contestKey: 'c4', signedError: -2, winnerCalled: false, disclosure: 0.5 }),
  buildPoll({ pollster: 4, pollsterName: 'Dune Analytics', contestKey: 'c1', signedError: 7, marginCovered: false, shareCovered: false, disclosure: 0.9 }),
  buildPoll({ pollster: 4, pollsterName: 'Dune Analytics', contestKey: 'c5', electionKey: 'e2', signedError: -3, winnerCalled: null, shareCovered: null }),
  buildPoll({ pollster: 5, pollsterName: 'Elm Opinion', contestKey: 'c6', electionKey: 'e2', signedError: -2.5, winnerCalled: false, disclosure: 0.4 }),
  buildPoll({ pollster: 6, pollsterName: 'Fir Data', contestKey: 'c7', electionKey: 'e2', signedError: 1 }),
  buildPoll({ pollster: 6, pollsterName: 'Fir Data', contestKey: 'c8', electionKey: 'e2', signedError: 2 }),
  buildPoll({ pollster: 6, pollsterName: 'Fir Data', contestKey: 'c9', electionKey: 'e2', signedError: 3 }),
]);

const SETTINGS = deepFreeze({ minPolls: 3, seed: 20260101, draws: 1000 });
const byId = (items: readonly ScorecardItem[], id: number): ScorecardItem =>
  items.find((i) => i.pollsterId === id) as ScorecardItem;

describe('computeScorecards on the hand fixture', () => {
  const { items, field } = computeScorecards(FIXTURE, SETTINGS);

  it('counts polls, contests and elections', () => {
    expect(items.map((i) => [i.pollsterId, i.polls, i.contests, i.elections])).toEqual([
      [1, 4, 4, 1],
      [3, 4, 4, 1],
      [2, 4, 4, 1],
      [4, 2, 2, 2],
      [5, 1, 1, 1],
      [6, 3, 3, 1],
    ]); // [practice] hand, table above; order: ranked by rank, then unranked by name
    expect(byId(items, 1).pollster).toBe('Alder Research');
  });

  it('mean absolute error, mean signed error and RMSE', () => {
    // [practice] hand: F1 |e| (1+1+2+0)/4 = 1, signed (1 − 1 + 2 + 0)/4 = 0.5, RMSE √(6/4) = 1.224745
    expect(byId(items, 1).meanAbsMarginError).toBeCloseTo(1, 12);
    expect(byId(items, 1).meanSignedError).toBeCloseTo(0.5, 12);
    expect(byId(items, 1).rmse).toBeCloseTo(1.224745, 6);
    // [practice] hand: F2 |e| 15/4 = 3.75, signed (4 + 5 − 2 + 4)/4 = 2.75, RMSE √(61/4) = 3.905125
    expect(byId(items, 2).meanAbsMarginError).toBeCloseTo(3.75, 12);
    expect(byId(items, 2).meanSignedError).toBeCloseTo(2.75, 12);
    expect(byId(items, 2).rmse).toBeCloseTo(3.905125, 6);
    // [practice] hand: F3 |e| 10/4 = 2.5, signed (−1 + 3 + 4 − 2)/4 = 1, RMSE √(30/4) = 2.738613
    expect(byId(items, 3).meanAbsMarginError).toBeCloseTo(2.5, 12);
    expect(byId(items, 3).meanSignedError).toBeCloseTo(1, 12);
    expect(byId(items, 3).rmse).toBeCloseTo(2.738613, 6);
    // [practice] hand: F4 |e| (7 + 3)/2 = 5, signed (7 − 3)/2 = 2, RMSE √(58/2) = 5.385165
    expect(byId(items, 4).meanAbsMarginError).toBeCloseTo(5, 12);
    expect(byId(items, 4).meanSignedError).toBeCloseTo(2, 12);
    expect(byId(items, 4).rmse).toBeCloseTo(5.385165, 6);
    // [practice] hand: F6 RMSE √((1 + 4 + 9)/3) = 2.160247
    expect(byId(items, 6).rmse).toBeCloseTo(2.160247, 6);
  });

  it('signed-error intervals are clustered by contest, t on G − 1 df, null when G < 2', () => {
    // [practice] hand, one poll per contest → one-sample t: F1 s² = 5/3, SE 0.645497, ±3.182446·SE = ±2.054260
    expect(byId(items, 1).meanSignedErrorInterval?.[0]).toBeCloseTo(-1.55426, 5);
    expect(byId(items, 1).meanSignedErrorInterval?.[1]).toBeCloseTo(2.55426, 5);
    // [practice] hand: F2 s² = 30.75/3 = 10.25, SE 1.600781 → 2.75 ± 5.094400
    expect(byId(items, 2).meanSignedErrorInterval?.[0]).toBeCloseTo(-2.3444, 4);
    expect(byId(items, 2).meanSignedErrorInterval?.[1]).toBeCloseTo(7.8444, 4);
    // [practice] hand: F4 G = 2: u = ±5, V = 2·50/4 = 25, SE 5, ±12.706205·5 = ±63.531024
    expect(byId(items, 4).meanSignedErrorInterval?.[0]).toBeCloseTo(-61.531024, 5);
    expect(byId(items, 4).meanSignedErrorInterval?.[1]).toBeCloseTo(65.531024, 5);
    // [practice] hand: F6 s² = 1, SE 1/√3, ±4.302653/√3 = ±2.484138
    expect(byId(items, 6).meanSignedErrorInterval?.[0]).toBeCloseTo(-0.484138, 5);
    expect(byId(items, 5).meanSignedErrorInterval).toBeNull();
    expect(byId(items, 5).meanSignedErrorNote).toMatch(/fewer than 2 contests/);
    expect(byId(items, 1).meanSignedErrorNote).toBeNull();
  });

  it('winner-called rates exclude and count ties; coverage and disclosure ignore nulls', () => {
    const f2 = byId(items, 2);
    // [practice] hand: F2 calls c1 yes, c2 no, c3 tie, c4 yes → 2/3, 3 calls, 1 no-call
    expect(f2.winnerCalledRate).toBeCloseTo(2 / 3, 12);
    expect([f2.calls, f2.callsCorrect, f2.noCalls]).toEqual([3, 2, 1]);
    expect(byId(items, 1).winnerCalledRate).toBe(1); // [practice] hand: 4 of 4
    expect(byId(items, 3).winnerCalledRate).toBe(0.5); // [practice] hand: 2 of 4
    // [practice] hand: F1 margin covered yes, yes, no, null → 2/3 over 3; share yes, no, no, no → 1/4
    expect(byId(items, 1).coverageRate).toBeCloseTo(2 / 3, 12);
    expect(byId(items, 1).coverageN).toBe(3);
    expect(byId(items, 1).shareCoverageRate).toBe(0.25);
    expect(byId(items, 2).coverageRate).toBe(0); // [practice] hand: 0 of 4
    expect(byId(items, 2).shareCoverageRate).toBeNull(); // [practice] all null
    expect(byId(items, 2).shareCoverageN).toBe(0);
    // [practice] hand: F1 disclosure (0.8 + 0.6 + 1.0)/3 = 0.8; F2 none → null
    expect(byId(items, 1).disclosure).toBeCloseTo(0.8, 12);
    expect(byId(items, 1).disclosureN).toBe(3);
    expect(byId(items, 2).disclosure).toBeNull();
    expect(field.nominalCoverage).toBe(0.95);
  });

  it('excess error, shrinkage and ranks match the hand computation', () => {
    expect(field.shrinkage.applied).toBe(true);
    expect(field.shrinkage.sigma2 as number).toBeCloseTo(107 / 36, 12); // [practice] hand, see fixture notes
    expect(field.shrinkage.tau2 as number).toBeCloseTo(1963 / 360, 12); // [practice] hand
    const expected: [number, number, number, number, number | null][] = [
      // id, excess, shrunk, B, rank — [practice] hand, see fixture notes
      [1, -2.5, -2.200179, 0.119928, 1],
      [2, 1.5, 1.320108, 0.119928, 3],
      [3, -0.25, -0.220018, 0.119928, 2],
      [4, 5, 3.23607, 0.352786, null],
    ];
    for (const [id, ex, sh, B, rank] of expected) {
      const it = byId(items, id);
      expect(it.excessError as number).toBeCloseTo(ex, 12);
      expect(it.excessErrorShrunk as number).toBeCloseTo(sh, 6);
      expect(it.shrinkageFactor as number).toBeCloseTo(B, 6);
      expect(it.rank).toBe(rank);
    }
    expect(byId(items, 1).excessErrorPosteriorSd as number).toBeCloseTo(0.808667, 6); // [practice] hand
    expect([byId(items, 1).excessErrorN, byId(items, 1).excessErrorContests]).toEqual([4, 4]);
    expect([byId(items, 4).excessErrorN, byId(items, 4).excessErrorContests]).toEqual([1, 1]);
    expect(byId(items, 6).excessError).toBeNull();
    expect(byId(items, 6).excessErrorShrunk).toBeNull();
  });

  it('lists but does not rank firms under minPolls or without a rival contest', () => {
    expect(items.map((i) => i.ranked)).toEqual([true, true, true, false, false, false]);
    expect(byId(items, 4).reason).toBe('fewer polls than the minimum (2 < 3)');
    expect(byId(items, 5).reason).toBe('fewer polls than the minimum (1 < 3)');
    expect(byId(items, 6).reason).toMatch(/no contest also polled by another firm/);
    for (const id of [4, 5, 6]) {
      const it = byId(items, id);
      expect([it.rank, it.rankInterval, it.pRankFirst, it.pSoleFirst]).toEqual([null, null, null, null]);
    }
    expect(byId(items, 1).reason).toBeNull();
    expect(field.ranked).toBe(3);
  });

  it('bootstrap intervals respect the data and the ranking invariants', () => {
    const ranked = items.filter((i) => i.ranked);
    // [practice] invariant: one unit of first place per draw among the ranked firms (always present here)
    expect(ranked.reduce((s, i) => s + (i.pRankFirst as number), 0)).toBeCloseTo(1, 12);
    // [practice] hand: a resampled mean of a firm's d_j lies between its smallest and largest d_j
    const dRange: Record<number, [number, number]> = { 1: [-3, -1], 2: [-1, 3], 3: [-3, 2], 4: [5, 5] };
    for (const [id, [lo, hi]] of Object.entries(dRange)) {
      const iv = byId(items, Number(id)).excessErrorInterval as readonly [number, number];
      expect(iv[0]).toBeGreaterThanOrEqual(lo - 1e-12);
      expect(iv[1]).toBeLessThanOrEqual(hi + 1e-12);
      expect(iv[0]).toBeLessThanOrEqual(iv[1]);
    }
    for (const it of ranked) {
      const [lo, hi] = it.rankInterval as readonly [number, number];
      expect(lo).toBeGreaterThanOrEqual(1);
      expect(hi).toBeLessThanOrEqual(3);
      expect(it.pSoleFirst as number).toBeLessThanOrEqual(it.pRankFirst as number);
    }
    // [practice] hand: F1's d is never above F3's or F2's in a contest (ties only in c1 with F3, c3 with F2),
    // so F1 is first in every draw except ties: rank interval [1, 1] and P(first) near 1.
    expect(byId(items, 1).rankInterval).toEqual([1, 1]);
    expect(byId(items, 1).pRankFirst as number).toBeGreaterThan(0.95);
    expect(byId(items, 6).excessErrorInterval).toBeNull();
  });

  it('field-level figures', () => {
    expect([field.polls, field.pollsters, field.contests, field.elections]).toEqual([18, 6, 9, 2]);
    // [practice] hand: Σ|e| = 4 + 15 + 10 + 10 + 2.5 + 6 = 47.5 over 18 polls = 2.638889
    expect(field.fieldMeanAbsMarginError).toBeCloseTo(2.638889, 6);
    // [practice] hand: Σe = 2 + 11 + 4 + 4 − 2.5 + 6 = 24.5 → 1.361111
    expect(field.fieldMeanSignedError).toBeCloseTo(1.361111, 6);
    // [practice] hand: 16 calls, 12 right → 0.75
    expect(field.fieldWinnerCalledRate).toBe(0.75);
    expect(field.excessDroppedPolls).toBe(5);
    expect(field.bootstrapContests).toBe(4);
    expect(field.rankedBy).toBe('excessErrorShrunk ascending');
  });

  it('is deterministic for a seed and draws differently with another seed', () => {
    expect(computeScorecards(FIXTURE, SETTINGS)).toEqual({ items, field });
    const other = computeScorecards(FIXTURE, { ...SETTINGS, seed: 99 });
    expect(other.items.map((i) => [i.pRankFirst, i.excessErrorInterval, i.excessErrorShrunkInterval])).not.toEqual(
      items.map((i) => [i.pRankFirst, i.excessErrorInterval, i.excessErrorShrunkInterval]),
    );
    // the point estimates do not depend on the seed
    expect(other.items.map((i) => [i.rank, i.excessErrorShrunk])).toEqual(items.map((i) => [i.rank, i.excessErrorShrunk]));
  });
});

describe('computeScorecards: minPolls and special cases', () => {
  it('minPolls 1 ranks F4 too; minPolls 5 ranks nobody', () => {
    const low = computeScorecards(FIXTURE, { ...SETTINGS, minPolls: 1 });
    // [practice] hand: shrunk F1 −2.200 < F3 −0.220 < F2 1.320 < F4 3.236
    expect(low.items.filter((i) => i.ranked).map((i) => [i.pollsterId, i.rank])).toEqual([
      [1, 1],
      [3, 2],
      [2, 3],
      [4, 4],
    ]);
    const high = computeScorecards(FIXTURE, { ...SETTINGS, minPolls: 5 });
    expect(high.field.ranked).toBe(0);
    expect(high.items.every((i) => !i.ranked && i.rank === null && i.reason !== null)).toBe(true);
  });

  it('without any contest polled by two firms there is no excess error and no bootstrap', () => {
    const polls = [
      buildPoll({ pollster: 'a', contestKey: 'x1', signedError: 1 }),
      buildPoll({ pollster: 'b', contestKey: 'x2', signedError: -2 }),
    ];
    const r = computeScorecards(polls, { minPolls: 1, seed: 1, draws: 10 });
    expect(r.field.ranked).toBe(0);
    expect(r.field.shrinkage.applied).toBe(false);
    expect(r.items.every((i) => i.excessError === null && i.excessErrorInterval === null)).toBe(true);
  });

  it('throws MetricInputError on degenerate input', () => {
    const ok = FIXTURE[0] as ScorecardPoll;
    const one = (o: Partial<ScorecardPoll>): ScorecardPoll[] => [{ ...ok, ...o }];
    expectInputError(() => computeScorecards([], SETTINGS), 'polls');
    expectInputError(() => computeScorecards([ok, { ...ok }], SETTINGS), 'polls[1].pollKey');
    expectInputError(() => computeScorecards(one({ pollKey: '' }), SETTINGS), 'polls[0].pollKey');
    expectInputError(() => computeScorecards(one({ pollster: '' }), SETTINGS), 'polls[0].pollster');
    expectInputError(
      () => computeScorecards([ok, { ...ok, pollKey: 'zz', pollsterName: 'Other' }], SETTINGS),
      'polls[1].pollsterName',
    );
    expectInputError(
      () => computeScorecards([ok, { ...ok, pollKey: 'zz', electionKey: 'e9' }], SETTINGS),
      'polls[1].electionKey',
    );
    expectInputError(() => computeScorecards(one({ contestKey: '' }), SETTINGS), 'polls[0].contestKey');
    expectInputError(() => computeScorecards(one({ signedError: Number.NaN }), SETTINGS), 'polls[0].signedError');
    expectInputError(() => computeScorecards(one({ absMarginError: -1 }), SETTINGS), 'polls[0].absMarginError');
    expectInputError(
      () => computeScorecards(one({ winnerCalled: undefined as unknown as null }), SETTINGS),
      'polls[0].winnerCalled',
    );
    expectInputError(
      () => computeScorecards(one({ marginCovered: 1 as unknown as boolean }), SETTINGS),
      'polls[0].marginCovered',
    );
    expectInputError(() => computeScorecards(one({ disclosure: 1.5 }), SETTINGS), 'polls[0].disclosure');
    expectInputError(() => computeScorecards(FIXTURE, { ...SETTINGS, minPolls: 0 }), 'settings.minPolls');
    expectInputError(() => computeScorecards(FIXTURE, { ...SETTINGS, seed: Number.NaN }), 'settings.seed');
    expectInputError(() => computeScorecards(FIXTURE, { ...SETTINGS, draws: 1.5 }), 'settings.draws');
    expectInputError(() => computeScorecards(FIXTURE, null as unknown as typeof SETTINGS), 'settings');
  });
});
