import { describe, expect, it } from 'vitest';
import { pearson, spearman } from './correlation';
import { deepFreeze, expectClose, expectInputError } from './testing';

const x = deepFreeze([1.2, -0.5, 2.3, 0.8, -1.1, 3.0, 0.4, 1.9]);
const y = deepFreeze([0.9, 0.1, 1.8, 1.2, -0.6, 2.2, -0.3, 1.0]);

describe('pearson', () => {
  it('reproduces the METHODS §6 check values', () => {
    const r = pearson(x, y);
    // [computed] METHODS §6: scipy 1.10.1 stats.pearsonr (and confidence_interval, Fisher z)
    expectClose(r.r, 0.920415);
    expectClose(r.p, 0.001186);
    expectClose(r.ciLow, 0.613934);
    expectClose(r.ciHigh, 0.985743);
    expect(r.df).toBe(6);
  });

  it('is symmetric, sign-flips with one variable, and ignores linear rescaling', () => {
    const r = pearson(x, y);
    expectClose(pearson(y, x).r, r.r, 1e-12);
    expectClose(pearson(x.map((v) => -v), y).r, -r.r, 1e-12);
    expectClose(pearson(x.map((v) => 3 * v + 1), y).p, r.p, 1e-10);
  });

  it('returns t null, p 0 and a degenerate interval for a perfect correlation', () => {
    const r = pearson([1, 2, 3, 4], [2, 4, 6, 8]);
    expect(r.r).toBe(1);
    expect(r.t).toBeNull();
    expect(r.p).toBe(0);
    expect(r.ciLow).toBe(1);
  });

  it('has no Fisher-z interval with n = 3', () => {
    const r = pearson([1, 2, 3], [1, 3, 2]);
    expect(r.ciLow).toBeNull();
    expect(r.ciHigh).toBeNull();
    expectClose(r.r, 0.5, 1e-12); // [practice: hand arithmetic]
  });

  it('throws MetricInputError naming the parameter on degenerate input', () => {
    expectInputError(() => pearson([1, 2], [1, 2]), 'x');
    expectInputError(() => pearson([1, 2, 3], [1, 2]), 'y');
    expectInputError(() => pearson([1, 1, 1], [1, 2, 3]), 'x');
    expectInputError(() => pearson([1, 2, 3], [4, 4, 4]), 'y');
    expectInputError(() => pearson([1, 2, Number.NaN], [1, 2, 3]), 'x[2]');
  });
});

describe('spearman', () => {
  it('reproduces the METHODS §6 check values', () => {
    const r = spearman(x, y);
    // [computed] METHODS §6: scipy 1.10.1 stats.spearmanr (t-approximation p)
    expectClose(r.rho, 0.904762);
    expectClose(r.p, 0.002008);
  });

  it('gives average ranks to ties', () => {
    // ranks of (1, 2, 2, 3) are (1, 2.5, 2.5, 4); with y = (1, 2, 3, 4):
    // Pearson of ranks = 0.948683 [practice: hand arithmetic, 3/√10]
    expectClose(spearman([1, 2, 2, 3], [1, 2, 3, 4]).rho, 3 / Math.sqrt(10), 1e-12);
  });

  it('depends only on order: any increasing transform leaves it unchanged', () => {
    const r = spearman(x, y);
    expectClose(spearman(x.map((v) => Math.exp(v)), y).rho, r.rho, 1e-12);
    const perfect = spearman([1, 2, 3, 4, 5], [1, 8, 27, 64, 125]);
    expect(perfect.rho).toBe(1);
    expect(perfect.t).toBeNull();
    expect(perfect.p).toBe(0);
  });

  it('throws MetricInputError naming the parameter on degenerate input', () => {
    expectInputError(() => spearman([1, 2], [1, 2]), 'x');
    expectInputError(() => spearman([1, 2, 3], [2, 2, 2]), 'y');
    expectInputError(() => spearman([1, 2, 3], [1, 2, 3, 4]), 'y');
  });
});
