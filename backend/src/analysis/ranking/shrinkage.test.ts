import { describe, expect, it } from 'vitest';
import {
  betweenFirmVariance,
  derSimonianLaird,
  empiricalBayesShrink,
  pooledWithinVariance,
  shrinkFirmMeans,
} from './shrinkage';
import { deepFreeze, expectInputError } from './testHelpers';

describe('derSimonianLaird', () => {
  it('reproduces the METHODS §6 check case', () => {
    const r = derSimonianLaird(deepFreeze([2.1, -0.5, 3.4, 1.2, 0.8]), deepFreeze([1.0, 1.5, 0.8, 2.0, 1.2]));
    // [computed] METHODS §6: statsmodels combine_effects(method_re='dl') 0.13.5, R metafor::rma
    expect(r.Q).toBeCloseTo(7.798366, 6);
    expect(r.pQ).toBeCloseTo(0.09925, 6);
    expect(r.tau2).toBeCloseTo(1.143996, 6);
    expect(r.muRE).toBeCloseTo(1.550735, 6);
    expect(r.seRE).toBeCloseTo(0.689454, 6);
    expect(r.muFE).toBeCloseTo(1.713725, 6);
    expect(r.seFE).toBeCloseTo(0.485071, 6);
    expect(r.I2).toBeCloseTo(0.487072, 6);
    expect(r.df).toBe(4);
  });

  it('truncates τ² and I² at 0 when Q < k − 1', () => {
    const r = derSimonianLaird([0.1, 0.2, 0.15], [1, 1, 2]);
    // [practice] hand: w = 1, 1, 0.5; μ_FE = (0.1 + 0.2 + 0.075)/2.5 = 0.15;
    // Q = 0.0025 + 0.0025 + 0 = 0.005 < 2 → τ² = 0, I² = 0, μ_RE = μ_FE
    expect(r.Q).toBeCloseTo(0.005, 12);
    expect(r.tau2).toBe(0);
    expect(r.I2).toBe(0);
    expect(r.muRE).toBeCloseTo(r.muFE, 12);
  });

  it('gives I² = 0 (not NaN) when all estimates are equal', () => {
    const r = derSimonianLaird([1, 1], [1, 2]);
    expect(r.Q).toBe(0); // [practice] hand: every y equals μ_FE
    expect(r.I2).toBe(0);
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => derSimonianLaird([1], [1]), 'y');
    expectInputError(() => derSimonianLaird([1, Number.NaN], [1, 1]), 'y[1]');
    expectInputError(() => derSimonianLaird([1, 2], [1]), 'v');
    expectInputError(() => derSimonianLaird([1, 2], [1, 0]), 'v[1]');
    expectInputError(() => derSimonianLaird([1, 2], [-1, 1]), 'v[0]');
  });
});

describe('pooledWithinVariance', () => {
  it('is the one-way ANOVA mean square within', () => {
    // [practice] hand: [1,3] ss 2; [2,2,5] mean 3, ss 1+1+4 = 6; df = 5 − 2 = 3 → 8/3
    const r = pooledWithinVariance(deepFreeze([[1, 3], [2, 2, 5]]));
    expect(r.ss).toBeCloseTo(8, 12);
    expect(r.df).toBe(3);
    expect(r.sigma2).toBeCloseTo(8 / 3, 12);
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => pooledWithinVariance([]), 'groups');
    expectInputError(() => pooledWithinVariance([[1], []]), 'groups[1]');
    expectInputError(() => pooledWithinVariance([[1], [2]]), 'groups');
    expectInputError(() => pooledWithinVariance([[1, Number.NaN]]), 'groups[0][1]');
  });
});

describe('betweenFirmVariance', () => {
  it('is DerSimonian–Laird with v = σ²/n', () => {
    // [practice] hand: v = 2/4 = 0.5 each, w = 2; μ_FE = 0; Q = 2 + 2 = 4; C = 4 − 8/4 = 2;
    // τ² = (4 − 1)/2 = 1.5
    expect(betweenFirmVariance([{ mean: -1, n: 4 }, { mean: 1, n: 4 }], 2).tau2).toBeCloseTo(1.5, 12);
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => betweenFirmVariance([{ mean: 1, n: 2 }], 1), 'firms');
    expectInputError(() => betweenFirmVariance([{ mean: 1, n: 2 }, { mean: 0, n: 2 }], 0), 'sigma2');
    expectInputError(() => betweenFirmVariance([{ mean: 1, n: 0 }, { mean: 0, n: 2 }], 1), 'firms[0].n');
    expectInputError(() => betweenFirmVariance([{ mean: 1, n: 2 }, { mean: Number.NaN, n: 2 }], 1), 'firms[1].mean');
  });
});

describe('empiricalBayesShrink', () => {
  it('reproduces the METHODS §7 check case', () => {
    const r = empiricalBayesShrink(deepFreeze({ mean: 2.5, n: 3 }), 4, 1, 0);
    // [computed] METHODS §7: ȳ 2.5, n 3, σ² 4, τ² 1, μ 0 → B 0.571429, shrunk 1.071429, SD 0.755929
    expect(r.B).toBeCloseTo(0.571429, 6);
    expect(r.shrunk).toBeCloseTo(1.071429, 6);
    expect(r.posteriorSd).toBeCloseTo(0.755929, 6);
  });

  it('agrees with the precision-weighted posterior (a second formulation)', () => {
    const firm = { mean: -1.2, n: 10 };
    const [s2, t2, mu] = [9, 0.5, 0.3];
    const r = empiricalBayesShrink(firm, s2, t2, mu);
    // [practice] normal–normal conjugacy: mean (n/σ²·ȳ + μ/τ²)/(n/σ² + 1/τ²), var 1/(n/σ² + 1/τ²)
    const prec = firm.n / s2 + 1 / t2;
    expect(r.shrunk).toBeCloseTo(((firm.n / s2) * firm.mean + mu / t2) / prec, 12);
    expect(r.posteriorSd).toBeCloseTo(Math.sqrt(1 / prec), 12);
  });

  it('τ² = 0 pulls all the way to μ; huge n leaves the mean alone', () => {
    expect(empiricalBayesShrink({ mean: 3, n: 5 }, 2, 0, 0.5)).toEqual({ B: 1, shrunk: 0.5, posteriorSd: 0 });
    const big = empiricalBayesShrink({ mean: 3, n: 1e9 }, 2, 1, 0);
    expect(big.shrunk).toBeCloseTo(3, 6); // [practice] B = 2e-9/(2e-9 + 1) ≈ 0
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => empiricalBayesShrink({ mean: Number.NaN, n: 3 }, 4, 1, 0), 'firm.mean');
    expectInputError(() => empiricalBayesShrink({ mean: 1, n: 0 }, 4, 1, 0), 'firm.n');
    expectInputError(() => empiricalBayesShrink({ mean: 1, n: 3 }, 0, 1, 0), 'sigma2');
    expectInputError(() => empiricalBayesShrink({ mean: 1, n: 3 }, 4, -1, 0), 'tau2');
    expectInputError(() => empiricalBayesShrink({ mean: 1, n: 3 }, 4, 1, Infinity), 'mu');
  });
});

describe('shrinkFirmMeans', () => {
  it('pools σ², estimates τ² and shrinks toward μ', () => {
    const firms = deepFreeze([
      { mean: -1, n: 4, ss: 3 },
      { mean: 1, n: 4, ss: 9 },
    ]);
    const r = shrinkFirmMeans(firms);
    // [practice] hand: σ² = (3 + 9)/(8 − 2) = 2; τ² = 1.5 (betweenFirmVariance case above);
    // B = 0.5/(0.5 + 1.5) = 0.25; shrunk = ±0.75; SD √(0.75·0.5) = 0.612372
    expect(r.applied).toBe(true);
    expect(r.sigma2).toBeCloseTo(2, 12);
    expect(r.tau2).toBeCloseTo(1.5, 12);
    expect(r.firms[0]?.shrunk).toBeCloseTo(-0.75, 12);
    expect(r.firms[1]?.shrunk).toBeCloseTo(0.75, 12);
    expect(r.firms[1]?.posteriorSd).toBeCloseTo(0.612372, 6);
  });

  it('leaves means unshrunk, with a note, when σ² cannot be estimated', () => {
    const one = shrinkFirmMeans([{ mean: 2, n: 3, ss: 1 }]);
    expect(one.applied).toBe(false);
    expect(one.note).toMatch(/fewer than 2 firms/);
    const singles = shrinkFirmMeans([{ mean: 2, n: 1, ss: 0 }, { mean: -1, n: 1, ss: 0 }]);
    expect(singles.note).toMatch(/within-firm variance not estimable/);
    expect(singles.firms.map((f) => f.shrunk)).toEqual([2, -1]);
    const flat = shrinkFirmMeans([{ mean: 2, n: 2, ss: 0 }, { mean: -1, n: 3, ss: 0 }]);
    expect(flat.note).toMatch(/is 0/);
    expect(flat.firms.map((f) => f.B)).toEqual([0, 0]);
  });

  it('throws MetricInputError on degenerate input', () => {
    expectInputError(() => shrinkFirmMeans([]), 'firms');
    expectInputError(() => shrinkFirmMeans([{ mean: 1, n: 0, ss: 0 }]), 'firms[0].n');
    expectInputError(() => shrinkFirmMeans([{ mean: 1, n: 1, ss: -1 }]), 'firms[0].ss');
    expectInputError(() => shrinkFirmMeans([{ mean: 1, n: 1, ss: 0 }], Number.NaN), 'mu');
  });
});
