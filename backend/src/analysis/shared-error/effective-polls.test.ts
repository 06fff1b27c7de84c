import { describe, expect, it } from 'vitest';
import { Z95 } from '../distributions';
import {
  contestAverageSummary,
  effectivePolls,
  errorStructureFromIcc,
  pollAverageInterval,
} from './effective-polls';
import { icc1 } from './icc';
import { deepFreeze, expectClose, expectInputError } from './testing';

describe('effectivePolls', () => {
  it('reproduces the METHODS §6 check values', () => {
    // [computed] METHODS §6 "Effective number of polls": k 10, ρ 0.3 → deff 3.7, n_eff 2.702703;
    // k 100, ρ 0.2 → 4.807692.
    const a = effectivePolls(10, 0.3);
    expectClose(a.deff, 3.7);
    expectClose(a.nEff, 2.702703);
    expectClose(effectivePolls(100, 0.2).nEff, 4.807692);
  });

  it('gives k polls when independent, one when perfectly correlated, and tends to 1/ρ', () => {
    expect(effectivePolls(7, 0).nEff).toBe(7);
    expect(effectivePolls(7, 1).nEff).toBe(1);
    expect(effectivePolls(1, 0.6).nEff).toBe(1);
    expect(effectivePolls(1_000_000, 0.25).nEff).toBeLessThan(4);
    expectClose(effectivePolls(1_000_000, 0.25).nEff, 4, 1e-4);
  });

  it('throws MetricInputError naming the parameter on degenerate input', () => {
    expectInputError(() => effectivePolls(0, 0.3), 'k');
    expectInputError(() => effectivePolls(2.5, 0.3), 'k');
    expectInputError(() => effectivePolls(10, -0.1), 'rho');
    expectInputError(() => effectivePolls(10, 1.2), 'rho');
    expectInputError(() => effectivePolls(10, Number.NaN), 'rho');
  });
});

describe('pollAverageInterval', () => {
  it('reproduces the METHODS §6 check values', () => {
    const r = pollAverageInterval(3, 10, 0.3);
    // [computed] METHODS §6: σ 3 → SE 1.824829 (0.948683 if independent)
    expectClose(r.adjustedSe, 1.824829);
    expectClose(r.naiveSe, 0.948683);
    expectClose(r.adjustedHalfWidth, Z95 * 1.824829, 1e-5);
    expectClose(r.adjustedSe, 3 / Math.sqrt(r.nEff), 1e-12);
  });

  it('throws MetricInputError naming the parameter on degenerate input', () => {
    expectInputError(() => pollAverageInterval(0, 10, 0.3), 'sigma');
    expectInputError(() => pollAverageInterval(3, 0, 0.3), 'k');
    expectInputError(() => pollAverageInterval(3, 10, 2), 'rho');
  });
});

describe('contestAverageSummary', () => {
  const polls = deepFreeze([
    { error: 3, samplingVariance: 9 },
    { error: 1, samplingVariance: 16 },
  ]);

  it('computes the naive SE from sampling variances and the adjusted SE from the structure', () => {
    const r = contestAverageSummary(polls, { sharedVariance: 4, withinVariance: 12 });
    // [practice: hand arithmetic] naive √(9 + 16)/2 = 2.5; adjusted √(4 + 12/2) = √10; ρ = 4/16;
    // n_eff = 2/(1 + 0.25) = 1.6
    expectClose(r.meanError, 2, 1e-12);
    expectClose(r.naiveSe, 2.5, 1e-12);
    expectClose(r.adjustedSe, Math.sqrt(10), 1e-12);
    expectClose(r.rho, 0.25, 1e-12);
    expectClose(r.nEff, 1.6, 1e-12);
    expect(r.naiveCovered).toBe(true);
    expect(r.adjustedCovered).toBe(true);
    expect(r.k).toBe(2);
  });

  it('reports the contest’s own DerSimonian–Laird excess variance', () => {
    const r = contestAverageSummary(polls, null);
    // [practice: hand arithmetic] w = 1/9, 1/16; μ_FE = 2.28; Q = (0.72²)/9 + (1.28²)/16 = 0.16 < 1
    expectClose(r.q, 0.16, 1e-12);
    expect(r.tau2).toBe(0);
    expect(r.i2).toBe(0);
    expect(r.adjustedSe).toBeNull();
    expect(r.nEff).toBeNull();
    expect(r.adjustedCovered).toBeNull();
  });

  it('judges coverage by |mean error| ≤ z·SE, the naive interval failing first', () => {
    const tight = [
      { error: 4, samplingVariance: 1 },
      { error: 5, samplingVariance: 1 },
      { error: 3, samplingVariance: 1 },
      { error: 4, samplingVariance: 1 },
    ];
    const r = contestAverageSummary(tight, { sharedVariance: 9, withinVariance: 2 });
    // naive SE = √4/4 = 0.5 → half-width 0.98 < 4; adjusted √(9 + 2/4) = 3.08 → 6.04 ≥ 4
    expect(r.naiveCovered).toBe(false);
    expect(r.adjustedCovered).toBe(true);
    const edge = contestAverageSummary([{ error: Z95, samplingVariance: 1 }], null);
    expect(edge.naiveCovered).toBe(true);
  });

  it('handles a single poll: no DL statistics, n_eff 1, adjusted SE = per-poll SD', () => {
    const r = contestAverageSummary([{ error: -2, samplingVariance: 4 }], { sharedVariance: 3, withinVariance: 6 });
    expect(r.tau2).toBeNull();
    expect(r.q).toBeNull();
    expect(r.qP).toBeNull();
    expect(r.i2).toBeNull();
    expectClose(r.nEff, 1, 1e-12);
    expectClose(r.adjustedSe, 3, 1e-12);
    expectClose(r.naiveSe, 2, 1e-12);
  });

  it('takes the structure from an ICC fit, truncating a negative σ_b² at 0', () => {
    const fit = icc1([[3.1, 2.4, 4.0], [-1.2, -0.3, -2.0], [0.5, 1.5, 0.2], [2.2, 1.0, 2.9]]);
    const s = errorStructureFromIcc(fit);
    expectClose(s.withinVariance, fit.msw, 1e-12);
    expectClose(s.sharedVariance / (s.sharedVariance + s.withinVariance), fit.icc, 1e-12);
    const negative = errorStructureFromIcc(icc1([[-2, 0, 2], [2, 0, -2], [-1, 1, 0]]));
    expect(negative.sharedVariance).toBe(0);
  });

  it('throws MetricInputError naming the parameter on degenerate input', () => {
    expectInputError(() => contestAverageSummary([], null), 'polls');
    expectInputError(() => contestAverageSummary([{ error: Number.NaN, samplingVariance: 1 }], null), 'polls[0].error');
    expectInputError(() => contestAverageSummary([{ error: 1, samplingVariance: 0 }], null), 'polls[0].samplingVariance');
    expectInputError(
      () => contestAverageSummary(polls, { sharedVariance: -1, withinVariance: 2 }),
      'structure.sharedVariance',
    );
    expectInputError(
      () => contestAverageSummary(polls, { sharedVariance: 0, withinVariance: 0 }),
      'structure.withinVariance',
    );
  });
});
