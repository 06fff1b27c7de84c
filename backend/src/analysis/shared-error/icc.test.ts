import { describe, expect, it } from 'vitest';
import { icc1 } from './icc';
import { deepFreeze, expectClose, expectInputError } from './testing';

// METHODS §6 "Intraclass correlation ICC(1)" example.
const groups = deepFreeze([
  [3.1, 2.4, 4.0],
  [-1.2, -0.3, -2.0],
  [0.5, 1.5, 0.2],
  [2.2, 1.0, 2.9],
]);

describe('icc1', () => {
  it('reproduces the METHODS §6 check values', () => {
    const r = icc1(groups);
    // [computed] METHODS §6: scipy 1.10.1 stats.f_oneway for F and p, moments for MSB/MSW/ICC.
    expectClose(r.msb, 10.380833);
    expectClose(r.msw, 0.688333);
    expectClose(r.f, 15.081114);
    expectClose(r.p, 0.001176);
    expectClose(r.icc, 0.824367);
    expect(r.dfBetween).toBe(3);
    expect(r.dfWithin).toBe(8);
    expect(r.estimator).toBe('anova-moments');
  });

  it('has n₀ equal to the group size and the textbook ICC form when balanced', () => {
    const r = icc1(groups);
    expectClose(r.n0, 3, 1e-12);
    // ICC(1) = (MSB − MSW)/(MSB + (n − 1)·MSW) for balanced groups (Shrout & Fleiss 1979 form)
    expectClose(r.icc, (r.msb - r.msw) / (r.msb + 2 * r.msw), 1e-12);
  });

  it('uses n₀ = [N − Σn²/N]/(J − 1) on unbalanced data', () => {
    const r = icc1([[1, 2], [3, 5, 4, 6], [0]]);
    // N = 7, Σn² = 4 + 16 + 1 = 21 → n₀ = (7 − 3)/2 = 2 [practice: hand arithmetic]
    expectClose(r.n0, 2, 1e-12);
    expect(r.n).toBe(7);
    expect(r.dfWithin).toBe(4);
  });

  it('reports a negative ICC when polls agree less within contests than across them', () => {
    const r = icc1([[-2, 0, 2], [2, 0, -2], [-1, 1, 0]]);
    expect(r.sigma2Between).toBeLessThan(0);
    expect(r.icc).toBeLessThan(0);
    expect(r.p).toBeGreaterThan(0.5);
  });

  it('is unchanged by a shift and by scaling of the errors', () => {
    const r = icc1(groups);
    const r2 = icc1(groups.map((g) => g.map((v) => 10 - 3 * v)));
    expectClose(r2.icc, r.icc, 1e-12);
    expectClose(r2.f, r.f, 1e-9);
  });

  it('throws MetricInputError naming the parameter on degenerate input', () => {
    expectInputError(() => icc1([[1, 2, 3]]), 'groups');
    expectInputError(() => icc1([[1, 2], []]), 'groups[1]');
    expectInputError(() => icc1([[1], [2], [3]]), 'groups');
    expectInputError(() => icc1([[1, 1], [1, 1]]), 'groups');
    expectInputError(() => icc1([[1, 1], [2, 2]]), 'groups');
    expectInputError(() => icc1([[1, Number.POSITIVE_INFINITY], [2, 3]]), 'groups[0][1]');
  });
});
