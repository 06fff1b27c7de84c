/**
 * Invariants of the per-poll metrics: properties that must hold for any input,
 * checked over a fixed, seeded set of invented polls.
 */
import { describe, expect, it } from 'vitest';
import seedrandom from 'seedrandom';
import * as metrics from './index';
import { buildContest, buildPoll, deepFreeze, near } from './test-helpers';

const opt = (key: string, bloc: string | null, votes: number) => ({ key, bloc, votes });
const rng = seedrandom('veracast-metrics-invariants');
const round1 = (x: number): number => Math.round(x * 10) / 10;

/** Invented polls of a four-option contest: shares to one decimal, undecided 2–15 points. */
const polls = Array.from({ length: 40 }, () => {
  const undecided = round1(2 + 13 * rng());
  const a = round1(30 + 20 * rng());
  const b = round1(25 + 15 * rng());
  const c = round1(Math.max(0.5, (100 - undecided - a - b) * 0.6));
  const other = round1(Math.max(0, 100 - undecided - a - b - c));
  return { A: a, B: b, C: c, other, undecided, n: 400 + Math.floor(1600 * rng()) };
});
const contest = buildContest({
  orientation: ['left', 'right'],
  options: [opt('A', 'left', 48_210), opt('B', 'right', 44_020), opt('C', null, 5_300), opt('other', null, 2_470)],
});
const certified = metrics.certifiedShares(contest.options);
const V = { A: certified.A ?? NaN, B: certified.B ?? NaN };

function sharesOf(p: (typeof polls)[number]): Record<string, number> {
  return { A: p.A, B: p.B, C: p.C, other: p.other, undecided: p.undecided };
}

describe('proportional reallocation leaves MTK A (and A′) unchanged', () => {
  it('for every poll', () => {
    for (const p of polls) {
      const raw = sharesOf(p);
      const prop = metrics.applyUndecided(raw, 'proportional', 'A', 'B');
      const aRaw = metrics.mtkAccuracy({ pollA: p.A, pollB: p.B, resultA: V.A, resultB: V.B, n: p.n }).a;
      const aProp = metrics.mtkAccuracy({ pollA: prop.A ?? NaN, pollB: prop.B ?? NaN, resultA: V.A, resultB: V.B, n: p.n }).a;
      near(aProp, aRaw, 1e-12);
      const aeRaw = metrics.aeAccuracy({ A: p.A, B: p.B, C: p.C }, certified, p.n);
      const aeProp = metrics.aeAccuracy({ A: prop.A ?? NaN, B: prop.B ?? NaN, C: prop.C ?? NaN }, certified, p.n);
      near(aeProp.aPrime.A ?? NaN, aeRaw.aPrime.A ?? NaN, 1e-12);
      near(aeProp.b, aeRaw.b, 1e-12);
    }
  });

  it('and computePollMetrics reports the same A under every treatment, while the margin error scales by 1/(1 − u)', () => {
    for (const p of polls) {
      const poll = buildPoll({ n: p.n, shares: sharesOf(p) });
      const raw = metrics.computePollMetrics(poll, contest, { undecided: 'raw', designEffect: 1 });
      const prop = metrics.computePollMetrics(poll, contest, { undecided: 'proportional', designEffect: 1 });
      const two = metrics.computePollMetrics(poll, contest, { undecided: 'two_party', designEffect: 1 });
      near(prop.mtkA, raw.mtkA ?? NaN, 1e-12);
      near(two.mtkA, raw.mtkA ?? NaN, 1e-12);
      near(prop.mtkSe, raw.mtkSe ?? NaN, 1e-12);
      const pollMargin = p.A - p.B;
      near(prop.marginError - raw.marginError, pollMargin / (1 - p.undecided / 100) - pollMargin, 1e-9);
    }
  });
});

describe('swapping A and B flips the signs', () => {
  it('of the margin error, MTK A and the two-party share error', () => {
    for (const p of polls) {
      near(metrics.signedMarginError(p.B, p.A, V.B, V.A), -metrics.signedMarginError(p.A, p.B, V.A, V.B), 1e-12);
      near(metrics.twoPartyShareError(p.B, p.A, V.B, V.A), -metrics.twoPartyShareError(p.A, p.B, V.A, V.B), 1e-12);
      const ab = metrics.mtkAccuracy({ pollA: p.A, pollB: p.B, resultA: V.A, resultB: V.B, n: p.n });
      const ba = metrics.mtkAccuracy({ pollA: p.B, pollB: p.A, resultA: V.B, resultB: V.A, n: p.n });
      near(ba.a, -ab.a, 1e-12);
      near(ba.z, -ab.z, 1e-12);
      near(ba.se, ab.se, 1e-15);
      near(ba.p, ab.p, 1e-12);
    }
  });

  it('in computePollMetrics when the orientation is reversed', () => {
    const reversed = { ...contest, orientation: ['right', 'left'] as [string, string] };
    for (const p of polls) {
      const poll = buildPoll({ n: p.n, shares: sharesOf(p) });
      for (const undecided of metrics.UNDECIDED_TREATMENTS) {
        const s = { undecided, designEffect: 1 };
        const ab = metrics.computePollMetrics(poll, contest, s);
        const ba = metrics.computePollMetrics(poll, reversed, s);
        expect([ba.refA, ba.refB]).toEqual([ab.refB, ab.refA]);
        near(ba.marginError, -ab.marginError, 1e-12);
        near(ba.mtkA, -(ab.mtkA ?? NaN), 1e-12);
        near(ba.twoPartyShareError, -(ab.twoPartyShareError ?? NaN), 1e-12);
        expect(ba.lean).toBe(ab.lean === 'A' ? 'B' : ab.lean === 'B' ? 'A' : 'none');
        expect(ba.absMarginError).toBeCloseTo(ab.absMarginError, 12);
        expect(ba.mosteller3).toBeCloseTo(ab.mosteller3, 12);
        expect(ba.winnerCalled).toBe(ab.winnerCalled);
      }
    }
  });
});

describe('scaling all poll shares by a constant leaves A unchanged', () => {
  it('for MTK A and Arzheimer–Evans A′', () => {
    for (const p of polls) {
      const base = metrics.mtkAccuracy({ pollA: p.A, pollB: p.B, resultA: V.A, resultB: V.B, n: p.n });
      const ae = metrics.aeAccuracy({ A: p.A, B: p.B, C: p.C }, certified, p.n);
      for (const c of [0.37, 0.9, 1.8]) {
        const scaled = metrics.mtkAccuracy({ pollA: p.A * c, pollB: p.B * c, resultA: V.A, resultB: V.B, n: p.n });
        near(scaled.a, base.a, 1e-12);
        const aeScaled = metrics.aeAccuracy({ A: p.A * c, B: p.B * c, C: p.C * c }, certified, p.n);
        for (const k of ['A', 'B', 'C']) near(aeScaled.aPrime[k] ?? NaN, ae.aPrime[k] ?? NaN, 1e-12);
      }
    }
  });
});

describe('inputs are never mutated', () => {
  it('every function runs on deep-frozen inputs and leaves them equal to a copy', () => {
    for (const p of polls.slice(0, 8)) {
      const shares = deepFreeze(sharesOf(p));
      const result = deepFreeze({ ...certified });
      const frozenContest = deepFreeze(structuredClone(contest));
      const poll = deepFreeze(buildPoll({ n: p.n, moe: 3.1, shares: { ...shares } }));
      const before = structuredClone({ shares, result, frozenContest, poll });

      metrics.certifiedShares(frozenContest.options);
      metrics.referencePair(frozenContest);
      for (const t of metrics.UNDECIDED_TREATMENTS) {
        metrics.applyUndecided(shares, t, 'A', 'B');
        metrics.computePollMetrics(poll, frozenContest, deepFreeze({ undecided: t, designEffect: 1.2 }));
      }
      metrics.scoredSet(shares, result);
      metrics.shareErrors(shares, result);
      metrics.mosteller3(shares, result);
      metrics.aeAccuracy(deepFreeze({ A: p.A, B: p.B, C: p.C, undecided: p.undecided }), result, p.n);
      metrics.mergeEmptyCategories(deepFreeze({ A: p.A, B: p.B, C: 0 }), deepFreeze({ A: 40, B: 40, C: 20 }));
      metrics.mtkAccuracy(deepFreeze({ pollA: p.A, pollB: p.B, resultA: V.A, resultB: V.B, n: p.n }));
      metrics.mtkMean(deepFreeze([0.05, -0.02, 0.11]));
      metrics.kishDesignEffect(deepFreeze([0.5, 1, 2]));

      expect({ shares, result, frozenContest, poll }).toEqual(before);
    }
  });

  it('results are fresh objects, not views of the inputs', () => {
    const shares = { A: 48, B: 44, undecided: 8 };
    const out = metrics.applyUndecided(shares, 'raw', 'A', 'B');
    out.A = 0;
    expect(shares.A).toBe(48);
  });
});
