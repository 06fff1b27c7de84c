import { describe, expect, it } from 'vitest';
import { aeAccuracy, mergeEmptyCategories } from './arzheimer-evans';
import { mtkAccuracy } from './mtk';
import { near } from './test-helpers';

describe('Arzheimer–Evans A′, B, B_w (METHODS §4)', () => {
  it("matches the check case (inputs from the authors' Stata help example)", () => {
    const r = aeAccuracy({ a: 40, b: 40, c: 20 }, { a: 30, b: 40, c: 30 }, 1000);
    expect(r.categories).toEqual(['a', 'b', 'c']);
    near(r.aPrime.a ?? NaN, 0.441833); // [computed] METHODS §4
    near(r.aPrime.b ?? NaN, 0); // [computed] METHODS §4
    near(r.aPrime.c ?? NaN, -0.538997); // [computed] METHODS §4
    near(r.se.a ?? NaN, 0.06455); // [computed] METHODS §4: SE 0.064550
    near(r.se.b ?? NaN, 0.06455); // [computed] METHODS §4
    near(r.se.c ?? NaN, 0.079057); // [computed] METHODS §4
    near(r.b, 0.326943); // [computed] METHODS §4
    near(r.bw, 0.294249); // [computed] METHODS §4
    near(r.chi2, 66.666667); // [computed] METHODS §4, scipy.stats.chisquare
    near(r.g2, 67.959615); // [computed] METHODS §4, scipy.stats.power_divergence
    expect(r.df).toBe(2); // [computed] METHODS §4: df = k − 1
    expect(r.chi2P).toBeLessThan(1e-10);
  });

  it('leaves undecided out and rescales over the named options', () => {
    const withU = aeAccuracy({ a: 36, b: 36, c: 18, undecided: 10 }, { a: 30, b: 40, c: 30 }, 1000);
    const without = aeAccuracy({ a: 40, b: 40, c: 20 }, { a: 30, b: 40, c: 30 }, 1000);
    expect(withU.categories).toEqual(['a', 'b', 'c']);
    near(withU.aPrime.a ?? NaN, without.aPrime.a ?? NaN, 1e-12);
    near(withU.b, without.b, 1e-12);
  });

  it('with two options A′ of the first equals MTK A, and its SE equals MTK SE when n counts their respondents', () => {
    const poll = { A: 44, B: 46 };
    const result = { A: 48, B: 50 };
    const mtk = mtkAccuracy({ pollA: 44, pollB: 46, resultA: 48, resultB: 50, n: 1000 });
    const ae = aeAccuracy(poll, result, 1000 * 0.9);
    near(ae.aPrime.A ?? NaN, mtk.a, 1e-12);
    near(ae.aPrime.B ?? NaN, -mtk.a, 1e-12);
    near(ae.se.A ?? NaN, mtk.se, 1e-12);
  });
});

describe('mergeEmptyCategories', () => {
  it('returns copies when nothing is empty', () => {
    const poll = { A: 50, B: 50 };
    const out = mergeEmptyCategories(poll, { A: 48, B: 52 });
    expect(out).toEqual({ poll: { A: 50, B: 50 }, result: { A: 48, B: 52 }, merges: [] });
    expect(out.poll).not.toBe(poll);
  });
  it('pools empty categories into one when the pool is non-empty on both sides', () => {
    const out = mergeEmptyCategories({ A: 48, B: 44, D: 0, C: 3 }, { A: 50, B: 45, D: 2, C: 0 });
    expect(out.poll).toEqual({ A: 48, B: 44, 'C+D': 3 });
    expect(out.result).toEqual({ A: 50, B: 45, 'C+D': 2 });
    expect(out.merges).toEqual(['C+D']);
  });
  it('folds a pool still empty on one side into the smallest certified category', () => {
    const out = mergeEmptyCategories({ A: 50, B: 45, C: 5, D: 0 }, { A: 48, B: 46, C: 4, D: 2 });
    expect(out.poll).toEqual({ A: 50, B: 45, 'C+D': 5 });
    expect(out.result).toEqual({ A: 48, B: 46, 'C+D': 6 });
    expect(out.merges).toEqual(['D into C+D']);
    const r = aeAccuracy(out.poll, out.result, 1000);
    expect(r.categories).toEqual(['A', 'B', 'C+D']);
  });
  it('can leave fewer than 2 categories, which aeAccuracy then refuses', () => {
    const out = mergeEmptyCategories({ A: 100, B: 0 }, { A: 60, B: 40 });
    expect(Object.keys(out.poll)).toEqual(['A+B']);
    expect(() => aeAccuracy(out.poll, out.result, 100)).toThrow(/at least 2 categories/);
  });
});
