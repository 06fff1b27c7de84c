import { describe, expect, it } from 'vitest';
import { bootstrapRanks, bootstrapWithinFirm } from './bootstrap';
import { averageRanks } from './ranks';
import { deepFreeze, expectInputError } from './testHelpers';
import type { ExcessPoll } from './types';

const poll = (pollster: string | number, contestKey: string, absMarginError: number): ExcessPoll => ({
  pollster,
  contestKey,
  absMarginError,
});

/** METHODS §7: absolute errors of three firms, resampled within firm. */
const GROUPS = deepFreeze([
  { id: 'A', values: [1, 2, 4] },
  { id: 'B', values: [2, 2.5, 3] },
  { id: 'C', values: [0.5, 3.5, 5] },
]);

/** Exact enumeration over all 27³ = 19,683 ordered resamples (rank 1 = smallest mean). */
function enumerateWithinFirm(): { sole: number[]; frac: number[]; meanRank: number[]; total: number } {
  const resamples = GROUPS.map((g) => {
    const out: number[] = [];
    for (const a of g.values) for (const b of g.values) for (const c of g.values) out.push((a + b + c) / 3);
    return out;
  });
  const sole = [0, 0, 0];
  const frac = [0, 0, 0];
  const rankSum = [0, 0, 0];
  let total = 0;
  for (const a of resamples[0] as number[]) {
    for (const b of resamples[1] as number[]) {
      for (const c of resamples[2] as number[]) {
        const m = [a, b, c];
        const r = averageRanks(m);
        const best = Math.min(a, b, c);
        const tied = m.filter((x) => x === best).length;
        m.forEach((x, i) => {
          rankSum[i] = (rankSum[i] as number) + (r[i] as number);
          if (x === best) frac[i] = (frac[i] as number) + 1 / tied;
          if (r[i] === 1) sole[i] = (sole[i] as number) + 1;
        });
        total += 1;
      }
    }
  }
  return {
    sole: sole.map((s) => s / total),
    frac: frac.map((s) => s / total),
    meanRank: rankSum.map((s) => s / total),
    total,
  };
}

describe('bootstrapWithinFirm: METHODS §7 exact-enumeration check', () => {
  const exact = enumerateWithinFirm();

  it('the exact enumeration reproduces METHODS §7', () => {
    expect(exact.total).toBe(19683);
    // [computed] METHODS §7: over all 19,683 resamples P(A ranks 1) = 0.456993 — A alone first
    expect(exact.sole[0]).toBeCloseTo(0.456993, 6);
    // [computed] reference-data/ranking/reference.json exactEnumeration.pRankFirst.A
    // (itertools + scipy.stats.rankdata, scipy 1.10.1): ties for first split fractionally
    expect(exact.frac[0]).toBeCloseTo(0.494361, 6);
  });

  it('a seeded Monte Carlo with 200,000 draws lands within 4 binomial SE of the exact values', () => {
    const draws = 200_000;
    const r = bootstrapWithinFirm(GROUPS, { seed: 'methods-7', draws });
    r.firms.forEach((f, i) => {
      // [practice] tolerance: each draw scores 0/1 (sole) or a credit in [0, 1] (fractional) with mean p,
      // so its variance is at most p(1 − p); SE = √(p(1 − p)/draws) ≈ 0.00111 for p ≈ 0.46.
      // 4·SE bounds a chance failure at about 6e-5 for an arbitrary seed.
      const sole = exact.sole[i] as number;
      const frac = exact.frac[i] as number;
      expect(Math.abs(f.pSoleFirst - sole)).toBeLessThan(4 * Math.sqrt((sole * (1 - sole)) / draws));
      expect(Math.abs(f.pRankFirst - frac)).toBeLessThan(4 * Math.sqrt((frac * (1 - frac)) / draws));
      // [practice] mean rank: ranks lie in [1, 3], so their SD is at most 1 → 4·SE = 4/√draws
      expect(Math.abs(f.meanRank - (exact.meanRank[i] as number))).toBeLessThan(4 / Math.sqrt(draws));
    });
    // [practice] invariant: one unit of first place per draw
    expect(r.firms.reduce((a, f) => a + f.pRankFirst, 0)).toBeCloseTo(1, 9);
  });

  it('is deterministic for a seed and changes with the seed', () => {
    const a = bootstrapWithinFirm(GROUPS, { seed: 7, draws: 500 });
    const b = bootstrapWithinFirm(GROUPS, { seed: 7, draws: 500 });
    const c = bootstrapWithinFirm(GROUPS, { seed: '7', draws: 500 });
    const d = bootstrapWithinFirm(GROUPS, { seed: 8, draws: 500 });
    expect(b).toEqual(a);
    expect(c.firms).toEqual(a.firms); // numbers and strings that print alike are one seed
    expect(d.firms).not.toEqual(a.firms);
  });

  it('reports data means, intervals inside the data range, and defaults to 1000 draws', () => {
    const r = bootstrapWithinFirm(GROUPS, { seed: 1 });
    expect(r.draws).toBe(1000);
    expect(r.firms[0]?.mean).toBeCloseTo(7 / 3, 12); // [practice] hand: (1 + 2 + 4)/3
    for (const [i, f] of r.firms.entries()) {
      const vals = (GROUPS[i] as { values: number[] }).values;
      expect(f.meanInterval[0]).toBeGreaterThanOrEqual(Math.min(...vals));
      expect(f.meanInterval[1]).toBeLessThanOrEqual(Math.max(...vals));
      expect(f.rankInterval[0]).toBeGreaterThanOrEqual(1);
      expect(f.rankInterval[1]).toBeLessThanOrEqual(3);
    }
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => bootstrapWithinFirm([], { seed: 1 }), 'groups');
    expectInputError(() => bootstrapWithinFirm([{ id: 'A', values: [] }], { seed: 1 }), 'groups[0].values');
    expectInputError(() => bootstrapWithinFirm([{ id: 'A', values: [1, Number.NaN] }], { seed: 1 }), 'groups[0].values[1]');
    expectInputError(
      () => bootstrapWithinFirm([{ id: 'A', values: [1] }, { id: 'A', values: [2] }], { seed: 1 }),
      'groups[1].id',
    );
    expectInputError(() => bootstrapWithinFirm([{ id: '', values: [1] }], { seed: 1 }), 'groups[0].id');
    expectInputError(() => bootstrapWithinFirm(GROUPS, undefined as unknown as { seed: number }), 'options');
    expectInputError(() => bootstrapWithinFirm(GROUPS, { seed: Number.NaN }), 'options.seed');
    expectInputError(() => bootstrapWithinFirm(GROUPS, { seed: 1, draws: 0 }), 'options.draws');
    expectInputError(() => bootstrapWithinFirm(GROUPS, { seed: 1, draws: 2.5 }), 'options.draws');
    expectInputError(() => bootstrapWithinFirm(GROUPS, { seed: 1, level: 1 }), 'options.level');
  });
});

describe('bootstrapRanks: contests as the resampling unit', () => {
  // c1: F1 |e| 0, F2 4 → d = −4, +4;  c2: F1 3, F2 1 → d = +2, −2.
  const TWO = deepFreeze([poll('F1', 'c1', 0), poll('F2', 'c1', 4), poll('F1', 'c2', 3), poll('F2', 'c2', 1)]);

  it('matches the exact contest bootstrap of a two-contest case', () => {
    // [practice] hand: draws {c1,c1} (1/4): F1 −4 first; {c1,c2} (1/2): F1 −1 vs F2 +1, F1 first;
    // {c2,c2} (1/4): F1 +2, F2 first → P(F1 first) = 3/4 exactly, no ties possible.
    const draws = 20_000;
    const r = bootstrapRanks(TWO, { seed: 11, draws });
    const f1 = r.firms[0];
    expect(r.contests).toBe(2);
    // [practice] tolerance 4·SE, SE = √(0.75·0.25/20000) = 0.00306
    expect(Math.abs((f1?.pRankFirst as number) - 0.75)).toBeLessThan(4 * Math.sqrt((0.75 * 0.25) / draws));
    expect(f1?.pSoleFirst).toBe(f1?.pRankFirst); // no ties in this case
    // [practice] hand: F1's resampled excess takes −4, −1, 2 → the 2.5% and 97.5% points are −4 and 2
    expect(f1?.excessInterval).toEqual([-4, 2]);
    expect(f1?.rankInterval).toEqual([1, 2]);
  });

  it('moves all polls of a contest together: with two firms, d_F1 = −d_F2 in every draw', () => {
    const polls = [
      poll('A', 'c1', 1.5), poll('B', 'c1', 4),
      poll('A', 'c2', 0.2), poll('B', 'c2', 2.7),
      poll('A', 'c3', 3.1), poll('B', 'c3', 0.4),
      poll('A', 'c4', 2.0), poll('B', 'c4', 2.9),
    ];
    const r = bootstrapRanks(polls, { seed: 3, draws: 400 });
    const [a, b] = r.firms;
    // [practice] invariant: mirror images only if contests (not single polls) are resampled
    expect(a?.excessInterval?.[0]).toBeCloseTo(-(b?.excessInterval?.[1] as number), 12);
    expect(a?.excessInterval?.[1]).toBeCloseTo(-(b?.excessInterval?.[0] as number), 12);
    expect((a?.pRankFirst as number) + (b?.pRankFirst as number)).toBeCloseTo(1, 12);
  });

  it('is deterministic for a seed, and different seeds draw differently', () => {
    const polls = [
      poll(1, 'c1', 1), poll(2, 'c1', 3), poll(3, 'c1', 2),
      poll(1, 'c2', 2.5), poll(2, 'c2', 0.5), poll(3, 'c2', 4),
      poll(1, 'c3', 0.7), poll(2, 'c3', 1.9), poll(3, 'c3', 1.1),
      poll(1, 'c4', 2.2), poll(3, 'c4', 0.9),
    ];
    const a = bootstrapRanks(polls, { seed: 2026 });
    expect(bootstrapRanks(polls, { seed: 2026 })).toEqual(a);
    expect(bootstrapRanks(polls, { seed: 2027 }).firms).not.toEqual(a.firms);
    expect(a.draws).toBe(1000);
  });

  it('ranks only `rankAmong`, while the other firms still act as rivals', () => {
    const polls = [poll('A', 'c1', 1), poll('B', 'c1', 2), poll('C', 'c1', 9), poll('A', 'c2', 2), poll('B', 'c2', 1)];
    const r = bootstrapRanks(polls, { seed: 5, draws: 200, rankAmong: ['A', 'B'] });
    const c = r.firms.find((f) => f.pollster === 'C');
    expect(c?.ranked).toBe(false);
    expect(c?.rankInterval).toBeNull();
    expect(c?.pRankFirst).toBeNull();
    // C's large miss is in the comparison means of A and B: A in c1 is 1 − (2 + 9)/2 = −4.5 ([practice] hand)
    expect(c?.excessInterval).not.toBeNull();
    const a = r.firms.find((f) => f.pollster === 'A');
    expect(a?.excessInterval?.[0]).toBeCloseTo(-4.5, 12);
    expect(r.firms.filter((f) => f.ranked).reduce((s, f) => s + (f.pRankFirst as number), 0)).toBeCloseTo(1, 12);
  });

  it("statistic 'shrunk' ranks the shrunk values and splits ties for first fractionally", () => {
    // [practice] hand: A |e| 1 vs B 3 in both contests → d_A = −2, d_B = +2 in every poll; within-firm
    // σ² = 0 in every draw → shrinkage not applied → A (−2) always first.
    const flat = [poll('A', 'c1', 1), poll('B', 'c1', 3), poll('A', 'c2', 1), poll('B', 'c2', 3)];
    const rf = bootstrapRanks(flat, { seed: 1, draws: 100, statistic: 'shrunk' });
    expect(rf.firms[0]?.pRankFirst).toBe(1);
    expect(rf.firms[0]?.shrunkInterval).toEqual([-2, -2]);
    // A and B differ by noise only (c1: d_A −1, c2: d_A +1): in a {c1,c2} draw both means are 0 and tie;
    // in {c1,c1} or {c2,c2} σ² = 0 and the raw means decide → ties for first happen, so sole < fractional.
    const noisy = [poll('A', 'c1', 1), poll('B', 'c1', 2), poll('A', 'c2', 2), poll('B', 'c2', 1)];
    const rn = bootstrapRanks(noisy, { seed: 1, draws: 300, statistic: 'shrunk' });
    const [a, b] = rn.firms;
    expect((a?.pRankFirst as number) + (b?.pRankFirst as number)).toBeCloseTo(1, 12);
    expect(a?.pSoleFirst as number).toBeLessThan(a?.pRankFirst as number);
  });

  it('does not mutate its input', () => {
    const polls = deepFreeze([poll('A', 'c1', 1), poll('B', 'c1', 2), poll('A', 'c2', 2), poll('B', 'c2', 4)]);
    const opts = deepFreeze({ seed: 1, draws: 50, rankAmong: ['A', 'B'] });
    expect(() => bootstrapRanks(polls, opts)).not.toThrow();
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => bootstrapRanks([], { seed: 1 }), 'polls');
    expectInputError(() => bootstrapRanks([poll('A', 'c1', 1), poll('A', 'c2', 2)], { seed: 1 }), 'polls');
    expectInputError(() => bootstrapRanks([poll('A', 'c1', -1)], { seed: 1 }), 'polls[0].absMarginError');
    expectInputError(() => bootstrapRanks(TWO, { seed: Infinity }), 'options.seed');
    expectInputError(() => bootstrapRanks(TWO, { seed: 1, draws: -5 }), 'options.draws');
    expectInputError(() => bootstrapRanks(TWO, { seed: 1, level: 0 }), 'options.level');
    expectInputError(
      () => bootstrapRanks(TWO, { seed: 1, statistic: 'median' as unknown as 'excess' }),
      'options.statistic',
    );
    expectInputError(() => bootstrapRanks(TWO, { seed: 1, rankAmong: ['F9'] }), 'options.rankAmong[0]');
    expectInputError(() => bootstrapRanks(TWO, { seed: 1, rankAmong: ['F1', 'F1'] }), 'options.rankAmong[1]');
    expectInputError(() => bootstrapRanks(TWO, { seed: 1, shrinkTarget: Number.NaN }), 'options.shrinkTarget');
  });
});
