import { describe, expect, it } from 'vitest';
import { andersonDarling, jarqueBera, qqPoints, shapiroWilk } from './normality';
import { deepFreeze, expectClose, expectInputError, seededNormal } from './testing';

// METHODS §6 "Normality of errors" example.
const x = deepFreeze([-2.1, -0.8, 0.3, 1.2, 2.5, 0.0, 0.7, -1.5, 3.9, 1.1, -0.4, 5.2]);

describe('shapiroWilk', () => {
  it('reproduces the METHODS §6 check values within 1e-5', () => {
    const r = shapiroWilk(x);
    // [computed] METHODS §6: scipy 1.10.1 stats.shapiro (single precision, hence 1e-5);
    // R shapiro.test agrees.
    expectClose(r.w, 0.948575, 1e-5);
    expectClose(r.p, 0.616248, 1e-5);
    expect(r.n).toBe(12);
  });

  it('uses the exact p for n = 3', () => {
    // W for (1, 2, 4) is 27/28 [practice: hand arithmetic: (a·(4 − 1))² / SS with a = 1/√2,
    // SS = 14/3]; p = (6/π)(asin √W − π/3).
    const r = shapiroWilk([1, 2, 4]);
    expectClose(r.w, 27 / 28, 1e-12);
    expectClose(r.p, (6 / Math.PI) * (Math.asin(Math.sqrt(27 / 28)) - Math.PI / 3), 1e-12);
  });

  it('is unchanged by order, shift and positive scaling', () => {
    const r = shapiroWilk(x);
    const r2 = shapiroWilk([...x].reverse().map((v) => 5 * v - 2));
    expectClose(r2.w, r.w, 1e-12);
    expectClose(r2.p, r.p, 1e-10);
  });

  it('does not reject seeded normal samples and rejects a strongly skewed one', () => {
    const normal = seededNormal('shapiro-normal');
    const sample = Array.from({ length: 400 }, () => normal());
    expect(shapiroWilk(sample).p).toBeGreaterThan(0.001);
    const skewed = sample.map((v) => Math.exp(1.5 * v));
    expect(shapiroWilk(skewed).p).toBeLessThan(1e-10);
  });

  it('throws MetricInputError naming x on degenerate input', () => {
    expectInputError(() => shapiroWilk([1, 2]), 'x');
    expectInputError(() => shapiroWilk([3, 3, 3, 3]), 'x');
    expectInputError(() => shapiroWilk([1, 2, Number.NaN]), 'x[2]');
    expectInputError(() => shapiroWilk(Array.from({ length: 5001 }, (_, i) => i)), 'x');
  });
});

describe('jarqueBera', () => {
  it('reproduces the METHODS §6 check values', () => {
    const r = jarqueBera(x);
    // [computed] METHODS §6: scipy 1.10.1 stats.jarque_bera; biased skewness and kurtosis
    expectClose(r.statistic, 0.97454);
    expectClose(r.p, 0.614301);
    expectClose(r.skewness, 0.677907);
    expectClose(r.kurtosis, 2.667061);
  });

  it('combines skewness and kurtosis as n/6·[S² + (K − 3)²/4]', () => {
    const r = jarqueBera(x);
    expectClose(r.statistic, (12 / 6) * (r.skewness ** 2 + (r.kurtosis - 3) ** 2 / 4), 1e-12);
    expectClose(jarqueBera(x.map((v) => -v)).skewness, -r.skewness, 1e-12);
  });

  it('throws MetricInputError naming x on degenerate input', () => {
    expectInputError(() => jarqueBera([1, 2]), 'x');
    expectInputError(() => jarqueBera([0, 0, 0]), 'x');
  });
});

describe('andersonDarling', () => {
  it('reproduces the METHODS §6 check values', () => {
    const r = andersonDarling(x);
    // [computed] METHODS §6: statsmodels 0.13.5 stats.diagnostic.normal_ad
    expectClose(r.statistic, 0.288705);
    expectClose(r.adjusted, 0.31126);
    expectClose(r.p, 0.552589);
  });

  it('stays finite with an extreme outlier (log-tail of Φ) and then rejects', () => {
    const xs = [...Array.from({ length: 2000 }, (_, i) => Math.sin(i)), 1e6];
    const r = andersonDarling(xs);
    expect(Number.isFinite(r.statistic)).toBe(true);
    expect(r.p).toBe(0);
  });

  it('throws MetricInputError naming x on degenerate input', () => {
    expectInputError(() => andersonDarling([1]), 'x');
    expectInputError(() => andersonDarling([2, 2, 2]), 'x');
  });
});

describe('qqPoints', () => {
  it('pairs sorted standardised values with Blom normal quantiles', () => {
    const pts = qqPoints([3, 1, 2]);
    // [computed] scipy 1.10.1 stats.norm.ppf(0.625/3.25) = −0.869424 (Blom position (1 − 0.375)/(3 + 0.25))
    expectClose(pts[0]?.theoretical, -0.869424);
    expectClose(pts[1]?.theoretical, 0, 1e-12);
    expectClose(pts[2]?.theoretical, 0.869424);
    expect(pts.map((p) => p.value)).toEqual([1, 2, 3]);
    expect(pts.map((p) => p.sample)).toEqual([-1, 0, 1]);
  });

  it('is increasing in both coordinates and symmetric in the quantiles', () => {
    const pts = qqPoints(x);
    for (let i = 1; i < pts.length; i++) {
      expect((pts[i]?.theoretical as number) > (pts[i - 1]?.theoretical as number)).toBe(true);
      expect((pts[i]?.sample as number) >= (pts[i - 1]?.sample as number)).toBe(true);
    }
    expectClose(pts[0]?.theoretical, -(pts[11]?.theoretical as number), 1e-12);
  });

  it('throws MetricInputError naming x on degenerate input', () => {
    expectInputError(() => qqPoints([1, 2]), 'x');
    expectInputError(() => qqPoints([4, 4, 4]), 'x');
  });
});
