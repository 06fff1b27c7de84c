import { describe, expect, it } from 'vitest';
import { standardDeviation, mean } from 'simple-statistics';
import { kishDesignEffect, marginMoe, marginSe, nEffFromStatedMoe, shareMoe, shareSe, wilsonInterval } from './sampling';
import { near } from './test-helpers';

describe('share and margin sampling error (METHODS §5, proportions)', () => {
  it('share MOE', () => {
    near(shareMoe(0.5, 1000), 0.03099); // [computed] METHODS §5: 0.030990
    near(shareMoe(0.48, 1000), 0.030965); // [computed] METHODS §5
    near(shareMoe(0.5, 600), 0.040008); // [computed] METHODS §5
    near(shareSe(0.5, 1000) * 1.959964, 0.03099); // [computed] METHODS §0 z and §5 MOE
  });
  it('margin SE and MOE for one multinomial sample', () => {
    near(marginSe(0.48, 0.45, 1000), 0.030481); // [computed] METHODS §5
    near(marginMoe(0.48, 0.45, 1000), 0.059742); // [computed] METHODS §5
    near(marginMoe(0.5, 0.5, 1000), 0.06198); // [computed] METHODS §5: 0.061980
  });
  it('the margin MOE is about twice the share MOE', () => {
    const ratio = marginMoe(0.48, 0.45, 1000) / shareMoe(0.48, 1000);
    expect(ratio).toBeGreaterThan(1.9);
    expect(ratio).toBeLessThan(2.0);
  });
});

describe('Kish design effect (METHODS §5, Kish 1965)', () => {
  it('matches the check values', () => {
    const a = kishDesignEffect([0.5, 1, 1, 1.5, 2]);
    near(a.deff, 1.180556); // [computed] METHODS §5
    near(a.nEff, 4.235294); // [computed] METHODS §5
    near(kishDesignEffect([1, 1, 1, 1, 4]).deff, 1.5625); // [computed] METHODS §5
  });
  it('equals 1 + CV² with the population (n) denominator', () => {
    const w = [0.7, 1.3, 2.1, 0.4, 1.0, 0.9];
    const cv = standardDeviation(w) / mean(w); // simple-statistics standardDeviation divides by n
    near(kishDesignEffect(w).deff, 1 + cv * cv, 1e-12);
  });
  it('is 1 for equal weights', () => {
    expect(kishDesignEffect([2, 2, 2]).deff).toBeCloseTo(1, 12);
  });
});

describe('n_eff implied by a stated MOE', () => {
  it('inverts the share MOE at p = 0.5', () => {
    near(nEffFromStatedMoe(100 * shareMoe(0.5, 600)), 600, 1e-9);
    near(nEffFromStatedMoe(100 * shareMoe(0.5, 1234.5)), 1234.5, 1e-9);
  });
  it('gives about 1000 for the usual ±3.1 points', () => {
    near(nEffFromStatedMoe(3.099), 1000, 0.2); // [computed] METHODS §5: share MOE 0.030990 at n 1000
  });
});

describe('Wilson score interval (Wilson 1927; check values Newcombe 1998)', () => {
  // [memory] Newcombe 1998, Statistics in Medicine 17:857–872, matched by statsmodels
  // proportion_confint(method="wilson") and R prop.test (METHODS §5).
  const checks: [number, number, number, number][] = [
    [81, 263, 0.255289, 0.36621],
    [15, 148, 0.062386, 0.160487],
    [0, 20, 0, 0.161125],
    [1, 29, 0.006113, 0.171755],
  ];
  for (const [x, n, lo, hi] of checks) {
    it(`${x}/${n}`, () => {
      const ci = wilsonInterval(x, n);
      near(ci.lower, lo);
      near(ci.upper, hi);
      expect(ci.lower).toBeLessThanOrEqual(ci.centre);
      expect(ci.centre).toBeLessThanOrEqual(ci.upper);
    });
  }
  it('is symmetric: x of n mirrors n − x of n', () => {
    const a = wilsonInterval(17, 90);
    const b = wilsonInterval(73, 90);
    near(a.lower, 1 - b.upper, 1e-12);
    near(a.upper, 1 - b.lower, 1e-12);
  });
});
