import { describe, expect, it } from 'vitest';
import { mtkAccuracy, mtkMean } from './mtk';
import { near } from './test-helpers';

describe('Martin–Traugott–Kennedy A (METHODS §3)', () => {
  it('poll R 44, D 46, undecided 10, n 1000; result 48.0/50.0', () => {
    const r = mtkAccuracy({ pollA: 44, pollB: 46, resultA: 48.0, resultB: 50.0, n: 1000 });
    near(r.a, -0.00363); // [computed] METHODS §3: A = −0.003630
    near(r.se, 0.066683); // [computed] METHODS §3: SE 0.066683
    near(r.z, -0.054433); // [computed] METHODS §3: z −0.054433
    near(r.p, 0.95659); // [computed] METHODS §3: p 0.956590
    near(r.lower, r.a - 1.959964 * r.se, 1e-6); // [computed] METHODS §0: z = 1.959964
    near(r.upper, r.a + 1.959964 * r.se, 1e-6);
  });

  it('poll 40/52, n 800; result 47/49', () => {
    const r = mtkAccuracy({ pollA: 40, pollB: 52, resultA: 47, resultB: 49, n: 800 });
    near(r.a, -0.220692); // [computed] METHODS §3
    near(r.se, 0.074356); // [computed] METHODS §3
    near(r.z, -2.968031); // [computed] METHODS §3
    near(r.p, 0.002997); // [computed] METHODS §3
    expect(r.upper).toBeLessThan(0);
  });

  it('mean of five A values with a t test on 4 df', () => {
    const m = mtkMean([0.05, -0.02, 0.11, 0.07, 0.03]);
    near(m.mean, 0.048); // [computed] METHODS §3
    near(m.se, 0.021541); // [computed] METHODS §3
    near(m.t, 2.228344); // [computed] METHODS §3
    expect(m.df).toBe(4); // [computed] METHODS §3: 4 df
    near(m.p, 0.089776); // [computed] METHODS §3, scipy.stats.ttest_1samp
    expect(m.k).toBe(5);
    expect(m.lower).toBeLessThan(0);
    expect(m.upper).toBeGreaterThan(m.mean);
  });

  it('A is logit(q) − logit(Q), the same log odds ratio written two ways', () => {
    const r = mtkAccuracy({ pollA: 37, pollB: 41, resultA: 44, resultB: 42, n: 700 });
    const logit = (x: number): number => Math.log(x / (1 - x));
    near(r.a, logit(37 / 78) - logit(44 / 86), 1e-12);
  });
});
