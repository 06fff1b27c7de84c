import { describe, expect, it } from 'vitest';
import { derSimonianLaird } from './dersimonian-laird';
import { deepFreeze, expectClose, expectInputError } from './testing';

const y = deepFreeze([2.1, -0.5, 3.4, 1.2, 0.8]);
const v = deepFreeze([1.0, 1.5, 0.8, 2.0, 1.2]);

describe('derSimonianLaird', () => {
  it('reproduces the METHODS §6 check values', () => {
    const r = derSimonianLaird(y, v);
    // [computed] METHODS §6: statsmodels 0.13.5 combine_effects(method_re="dl"); R metafor::rma.
    expectClose(r.q, 7.798366);
    expectClose(r.qP, 0.09925);
    expectClose(r.tau2, 1.143996);
    expectClose(r.muRE, 1.550735);
    expectClose(r.seRE, 0.689454);
    expectClose(r.muFE, 1.713725);
    expectClose(r.seFE, 0.485071);
    expectClose(r.i2, 0.487072);
    expect(r.df).toBe(4);
  });

  it('truncates τ² and I² at 0 and then pools like the fixed-effect model', () => {
    const r = derSimonianLaird([1.0, 1.2, 0.9, 1.1], [2.0, 1.0, 1.5, 3.0]);
    expect(r.q).toBeLessThan(r.df);
    expect(r.tau2).toBe(0);
    expect(r.i2).toBe(0);
    expectClose(r.muRE, r.muFE, 1e-12);
    expectClose(r.seRE, r.seFE, 1e-12);
  });

  it('gives Q = 0, τ² = 0 and I² = 0 (not NaN) when all estimates are equal', () => {
    const r = derSimonianLaird([2, 2, 2], [1, 2, 3]);
    expect(r.q).toBe(0);
    expect(r.i2).toBe(0);
    expect(r.tau2).toBe(0);
    expectClose(r.qP, 1, 1e-12);
  });

  it('never gives a random-effects SE below the fixed-effect SE', () => {
    const r = derSimonianLaird(y, v);
    expect(r.seRE).toBeGreaterThanOrEqual(r.seFE);
    // C = Σw − Σw²/Σw by hand for the example [practice: hand arithmetic]
    const w = v.map((x) => 1 / x);
    const sw = w.reduce((a, b) => a + b, 0);
    expectClose(r.c, sw - w.reduce((a, b) => a + b * b, 0) / sw, 1e-12);
  });

  it('throws MetricInputError naming the parameter on degenerate input', () => {
    expectInputError(() => derSimonianLaird([1], [1]), 'y');
    expectInputError(() => derSimonianLaird([1, 2], [1]), 'v');
    expectInputError(() => derSimonianLaird([1, 2], [1, 0]), 'v[1]');
    expectInputError(() => derSimonianLaird([1, 2], [-1, 1]), 'v[0]');
    expectInputError(() => derSimonianLaird([1, Number.NaN], [1, 1]), 'y[1]');
  });
});
