import { describe, expect, it } from 'vitest';
import { clusteredMean } from './clustered-mean';
import { computeSharedError, type SharedErrorPoll } from './compute';
import { icc1 } from './icc';
import { deepFreeze, expectClose, nonFinitePaths, seededNormal, seededUniform } from './testing';

let counter = 0;
function buildPoll(overrides: Partial<SharedErrorPoll> = {}): SharedErrorPoll {
  counter += 1;
  return {
    pollKey: `p${counter}`,
    contestKey: 'c1',
    firm: 'F1',
    signedError: 1,
    samplingVariance: 10,
    certifiedMargin: 4,
    ...overrides,
  };
}

// METHODS §6 clustered-mean example, with firms F1..F4 rotating through the polls.
const methodsContests: readonly (readonly number[])[] = [[2.0, 3.1, 1.4], [-0.5, 0.4], [1.8, 2.6, 2.2, 1.1], [-1.0, 0.3], [0.9]];
function methodsPolls(): SharedErrorPoll[] {
  let i = 0;
  return methodsContests.flatMap((errors, c) =>
    errors.map((e) => buildPoll({ contestKey: `c${c + 1}`, firm: `F${(i++ % 4) + 1}`, signedError: e })),
  );
}

/** A seeded election: 30 contests, 8 firms, shared contest error SD 3, house SD 1, noise SD 1.5. */
function simulatedElection(seed: string): SharedErrorPoll[] {
  const normal = seededNormal(`${seed}-n`);
  const uniform = seededUniform(`${seed}-u`);
  const house = Array.from({ length: 8 }, () => normal());
  const polls: SharedErrorPoll[] = [];
  for (let c = 0; c < 30; c++) {
    const shared = 2 + 3 * normal();
    const certifiedMargin = 10 * normal();
    for (let f = 0; f < 8; f++) {
      if (uniform() < 0.35) continue;
      polls.push(
        buildPoll({
          contestKey: `c${String(c).padStart(2, '0')}`,
          firm: `F${f}`,
          signedError: shared + (house[f] as number) + 1.5 * normal(),
          samplingVariance: 4 + 8 * uniform(),
          certifiedMargin,
        }),
      );
    }
  }
  return polls;
}

function expectNoNonFinite(value: unknown): void {
  expect(nonFinitePaths(value)).toEqual([]);
}

describe('computeSharedError', () => {
  it('reproduces the METHODS §6 clustered check values through the whole pipeline', () => {
    const r = computeSharedError({ polls: deepFreeze(methodsPolls()) });
    // [computed] METHODS §6: statsmodels 0.13.5 OLS cov_type="cluster", use_t=True
    expectClose(r.meanSignedError, 1.191667);
    expectClose(r.clusteredSe, 0.534561);
    expectClose(r.t, 2.229244);
    expectClose(r.p, 0.089686);
    expect(r.df).toBe(4);
    expect(r.polls).toBe(12);
    expect(r.contests).toBe(5);
    expect(r.firms).toBe(4);
    expectNoNonFinite(r);
  });

  it('returns the SPEC §7 shape with every field consistent with the core functions', () => {
    const polls = deepFreeze(simulatedElection('full'));
    const r = computeSharedError({ polls });
    const keys = [
      'polls', 'contests', 'meanSignedError', 'clusteredSe', 'df', 't', 'p', 'ciLow', 'ciHigh', 'icc', 'iccF',
      'iccP', 'shapiroW', 'shapiroP', 'jarqueBera', 'jarqueBeraP', 'andersonDarling', 'andersonDarlingP',
      'varianceSplit', 'contestBias', 'houseEffects', 'contestsDetail', 'pairs', 'qq', 'warnings',
    ];
    for (const k of keys) expect(r).toHaveProperty(k);
    expect(r.warnings).toEqual([]);
    expectNoNonFinite(r);

    const cm = clusteredMean(polls.map((p) => p.signedError), polls.map((p) => p.contestKey));
    expectClose(r.clusteredSe, cm.se, 1e-12);
    const groups = new Map<string, number[]>();
    for (const p of polls) groups.set(p.contestKey, [...(groups.get(p.contestKey) ?? []), p.signedError]);
    expectClose(r.icc, icc1([...groups.values()]).icc, 1e-12);

    expect(r.contestsDetail).toHaveLength(r.contests);
    expect(r.pairs).toHaveLength((8 * 7) / 2);
    expect(r.qq).toHaveLength(r.polls);
    const split = r.varianceSplit;
    expect(split).not.toBeNull();
    expectClose((split?.shared ?? 0) + (split?.house ?? 0) + (split?.noise ?? 0), 1, 1e-12);
    for (const d of r.contestsDetail) {
      expect(d.adjustedSe).not.toBeNull();
      expect(d.nEff as number).toBeLessThanOrEqual(d.k);
      expectClose(d.averageMargin, (d.certifiedMargin as number) + d.meanError, 1e-12);
    }
  });

  it('shows a large shared error: significant mean, high ICC, naive intervals missing more often', () => {
    const r = computeSharedError({ polls: simulatedElection('shared') });
    // contest SD 3 against within SD √(1 + 2.25) ≈ 1.8: ICC ≈ 9/12.25 ≈ 0.73 [practice]
    expect(r.icc as number).toBeGreaterThan(0.5);
    expect(r.p as number).toBeLessThan(0.05);
    expect(r.varianceSplit?.shared as number).toBeGreaterThan(0.5);
    const naive = r.contestsDetail.filter((d) => d.naiveCovered).length;
    const adjusted = r.contestsDetail.filter((d) => d.adjustedCovered).length;
    expect(adjusted).toBeGreaterThan(naive);
    expect(r.contestsDetail.every((d) => (d.adjustedSe as number) > (d.naiveSe as number))).toBe(true);
  });

  it('one contest: no clustered SE, no ICC, no variance split, plain warnings', () => {
    const polls = [1.2, 0.4, 2.2, 1.9].map((e, i) => buildPoll({ contestKey: 'only', firm: `F${i}`, signedError: e }));
    const r = computeSharedError({ polls });
    expect(r.contests).toBe(1);
    expect(r.clusteredSe).toBeNull();
    expect(r.t).toBeNull();
    expect(r.p).toBeNull();
    expect(r.icc).toBeNull();
    expect(r.varianceSplit).toBeNull();
    expectClose(r.meanSignedError, 1.425, 1e-12);
    expect(r.shapiroW).not.toBeNull();
    expect(r.contestsDetail[0]?.tau2).not.toBeNull();
    expect(r.contestsDetail[0]?.adjustedSe).toBeNull();
    expect(r.warnings.join(' ')).toMatch(/Only one contest/);
    expect(r.warnings.join(' ')).toMatch(/intraclass correlation/);
    expectNoNonFinite(r);
  });

  it('one poll per contest: no ICC, no DL per contest, no variance split', () => {
    const polls = [0.5, -1.0, 2.5, 1.1].map((e, i) => buildPoll({ contestKey: `c${i}`, firm: `F${i}`, signedError: e }));
    const r = computeSharedError({ polls });
    expect(r.clusteredSe).not.toBeNull();
    expect(r.icc).toBeNull();
    expect(r.varianceSplit).toBeNull();
    expect(r.contestsDetail.every((d) => d.tau2 === null && d.q === null && d.i2 === null)).toBe(true);
    expect(r.contestsDetail.every((d) => d.naiveSe !== null && d.adjustedSe === null)).toBe(true);
    const text = r.warnings.join(' ');
    expect(text).toMatch(/single poll/);
    expect(text).toMatch(/split of error variance/);
    expectNoNonFinite(r);
  });

  it('a contest polled by one firm: its leave-one-out house effect is null and the pair is thin', () => {
    const polls = [
      buildPoll({ contestKey: 'c1', firm: 'A', signedError: 1 }),
      buildPoll({ contestKey: 'c1', firm: 'B', signedError: 2 }),
      buildPoll({ contestKey: 'c2', firm: 'C', signedError: -1 }),
      buildPoll({ contestKey: 'c2', firm: 'C', signedError: 0.5 }),
    ];
    const r = computeSharedError({ polls });
    expect(r.houseEffects.find((h) => h.firm === 'C')?.leaveOneOut).toBeNull();
    expect(r.pairs.every((p) => p.insufficient && p.pearson === null)).toBe(true);
    expect(r.warnings.join(' ')).toMatch(/No pair of firms polled at least 5 contests/);
    expectNoNonFinite(r);
  });

  it('all errors equal: nulls and a warning instead of NaN', () => {
    const polls = ['c1', 'c1', 'c2', 'c2', 'c3'].map((c, i) => buildPoll({ contestKey: c, firm: `F${i % 2}`, signedError: 2 }));
    const r = computeSharedError({ polls });
    expect(r.meanSignedError).toBe(2);
    for (const k of ['clusteredSe', 't', 'p', 'icc', 'shapiroW', 'jarqueBera', 'andersonDarling', 'varianceSplit'] as const) {
      expect(r[k]).toBeNull();
    }
    expect(r.qq).toEqual([]);
    expect(r.warnings.join(' ')).toMatch(/All 5 errors are equal/);
    expectNoNonFinite(r);
  });

  it('fewer than 3 errors: normality checks and Q–Q plot are empty with a warning', () => {
    const polls = [buildPoll({ contestKey: 'a', signedError: 1 }), buildPoll({ contestKey: 'b', signedError: 3 })];
    const r = computeSharedError({ polls });
    expect(r.shapiroW).toBeNull();
    expect(r.andersonDarlingP).toBeNull();
    expect(r.qq).toEqual([]);
    expect(r.warnings.join(' ')).toMatch(/Only 2 errors/);
    expectNoNonFinite(r);
  });

  it('no polls: an empty result that says so', () => {
    const r = computeSharedError({ polls: [] });
    expect(r.polls).toBe(0);
    expect(r.meanSignedError).toBeNull();
    expect(r.contestsDetail).toEqual([]);
    expect(r.warnings.join(' ')).toMatch(/no polls/);
  });

  it('leaves out unusable and repeated rows, and flags missing sampling variances', () => {
    const good = methodsPolls();
    const polls = [
      ...good,
      buildPoll({ pollKey: 'bad-error', signedError: Number.NaN }),
      buildPoll({ pollKey: 'no-firm', firm: '' }),
      { ...(good[0] as SharedErrorPoll) },
      buildPoll({ contestKey: 'c9', signedError: 0.2, samplingVariance: 0 }),
    ];
    const r = computeSharedError({ polls });
    expect(r.polls).toBe(13);
    const text = r.warnings.join(' ');
    expect(text).toMatch(/2 polls were left out.*bad-error, no-firm/);
    expect(text).toMatch(/Repeated poll keys/);
    expect(text).toMatch(/sampling variance.*c9/);
    const c9 = r.contestsDetail.find((d) => d.contestKey === 'c9');
    expect(c9?.naiveSe).toBeNull();
    expect(c9?.naiveCovered).toBeNull();
    expect(c9?.adjustedSe).not.toBeNull();
    expectNoNonFinite(r);
  });

  it('shows no average margin when polls of a contest disagree on the certified margin', () => {
    const polls = [
      buildPoll({ contestKey: 'a', signedError: 1, certifiedMargin: 3 }),
      buildPoll({ contestKey: 'a', signedError: 2, certifiedMargin: 5 }),
      buildPoll({ contestKey: 'b', signedError: 0, certifiedMargin: -2 }),
    ];
    const r = computeSharedError({ polls });
    const a = r.contestsDetail.find((d) => d.contestKey === 'a');
    const b = r.contestsDetail.find((d) => d.contestKey === 'b');
    expect(a?.certifiedMargin).toBeNull();
    expect(a?.averageMargin).toBeNull();
    expect(b?.averageMargin).toBe(-2);
    expect(r.warnings.join(' ')).toMatch(/certified margin is missing or differs between polls of: a;/);
  });

  it('warns about an invalid minCommon and uses 5', () => {
    const r = computeSharedError({ polls: methodsPolls(), minCommon: 1 });
    expect(r.warnings.join(' ')).toMatch(/minCommon/);
  });

  it('does not mutate its input', () => {
    const polls = deepFreeze(simulatedElection('frozen'));
    expect(() => computeSharedError({ polls })).not.toThrow();
  });
});
