/**
 * Checks every case of reference-data/ranking/reference.json, written by
 * reference-data/ranking/make_reference.py with numpy 1.24.2, scipy 1.10.1,
 * statsmodels 0.13.5 and pandas 1.5.3 (the exact call of each block is stored in
 * its `call` field; provenance in reference-data/ranking/README.md).
 * All expected numbers below are [computed] values read from that file.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { bootstrapWithinFirm } from './bootstrap';
import { breakdowns, samplingFunnel } from './breakdowns';
import { clusteredMean } from './clustered';
import { contestAdjustedExcess } from './excess';
import { percentileInvertedCdf, percentileLinear } from './percentiles';
import { averageRanks } from './ranks';
import { computeScorecards, type ScorecardPoll } from './scorecards';
import { derSimonianLaird, empiricalBayesShrink, pooledWithinVariance } from './shrinkage';
import { deepFreeze } from './testHelpers';

type Num = number;
interface Reference {
  versions: Record<string, string>;
  averageRanks: { cases: { values: Num[]; ranks: Num[] }[] };
  percentiles: { cases: { values: Num[]; p: Num[]; linear: Num[]; inverted_cdf: Num[] }[] };
  exactEnumeration: {
    groups: Record<string, Num[]>;
    resamples: Num;
    pSoleFirst: Record<string, Num>;
    pRankFirst: Record<string, Num>;
    meanRank: Record<string, Num>;
  };
  clusteredMean: {
    cases: { values: Num[]; clusters: string[]; mean: Num; se: Num; t: Num; p: Num; df: Num; lo: Num; hi: Num }[];
  };
  derSimonianLaird: {
    cases: { y: Num[]; v: Num[]; tau2: Num; Q: Num; I2: Num; pQ: Num; muFE: Num; seFE: Num; muRE: Num; seRE: Num }[];
  };
  shrinkage: {
    cases: { mean: Num; n: Num; sigma2: Num; tau2: Num; mu: Num; B: Num; shrunk: Num; posteriorSd: Num }[];
  };
  pooledWithin: { groups: Num[][]; sigma2: Num; df: Num; ss: Num };
  samplingFunnel: {
    points: { n: Num; marginSe: Num; expectedAbsMarginError: Num; marginMoe95: Num }[];
    deff: { n: Num; deff: Num; expectedAbsMarginError: Num };
  };
  tInterval: { cases: { values: Num[]; mean: Num; lo: Num; hi: Num }[] };
  audit: {
    minPolls: Num;
    polls: ScorecardPoll[];
    fieldMeanAbsMarginError: Num;
    excessDroppedPolls: Num;
    sigma2: Num;
    tau2: Num;
    pollExcess: (Num | null)[];
    firms: {
      pollsterId: Num;
      polls: Num;
      contests: Num;
      elections: Num;
      meanAbsMarginError: Num;
      meanSignedError: Num;
      rmse: Num;
      meanSignedErrorInterval: [Num, Num] | null;
      winnerCalledRate: Num | null;
      coverageRate: Num | null;
      shareCoverageRate: Num | null;
      calls: Num;
      noCalls: Num;
      disclosure: Num | null;
      excessError: Num | null;
      excessErrorN: Num;
      excessErrorShrunk: Num | null;
      ranked: boolean;
      rank: Num | null;
    }[];
  };
}

const REF = deepFreeze(
  JSON.parse(
    readFileSync(new URL('../../../../reference-data/ranking/reference.json', import.meta.url), 'utf8'),
  ) as Reference,
);

/** |actual − expected| <= tol (default 1e-9; METHODS' default tolerance is 1e-6). */
function close(actual: number | null | undefined, expected: number | null, tol = 1e-9): void {
  if (expected === null) {
    expect(actual).toBeNull();
    return;
  }
  expect(typeof actual).toBe('number');
  expect(Math.abs((actual as number) - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(tol);
}

describe('reference.json', () => {
  it('was produced with the recorded library versions', () => {
    expect(REF.versions.scipy).toBe('1.10.1');
    expect(REF.versions.numpy).toBe('1.24.2');
    expect(REF.versions.statsmodels).toMatch(/^0\.13\.5/);
  });

  it('averageRanks = scipy.stats.rankdata(method="average")', () => {
    for (const c of REF.averageRanks.cases) expect(averageRanks(c.values)).toEqual(c.ranks);
  });

  it('percentiles = numpy.quantile(method="linear" | "inverted_cdf")', () => {
    for (const c of REF.percentiles.cases) {
      c.p.forEach((p, i) => {
        close(percentileLinear(c.values, p), c.linear[i] as number, 1e-12);
        expect(percentileInvertedCdf(c.values, p)).toBe(c.inverted_cdf[i]);
      });
    }
  });

  it('exact enumeration (itertools) of METHODS §7 and a seeded Monte Carlo agree', () => {
    const e = REF.exactEnumeration;
    expect(e.resamples).toBe(19683);
    close(e.pSoleFirst.A as number, 0.456993, 1e-6); // [computed] METHODS §7
    const groups = Object.entries(e.groups).map(([id, values]) => ({ id, values }));
    const draws = 100_000;
    const r = bootstrapWithinFirm(groups, { seed: 'reference', draws });
    for (const f of r.firms) {
      const id = f.id as string;
      for (const [got, want] of [
        [f.pSoleFirst, e.pSoleFirst[id] as number],
        [f.pRankFirst, e.pRankFirst[id] as number],
      ] as const) {
        // [practice] 4 binomial SE, SE = √(p(1 − p)/draws) (see bootstrap.test.ts)
        expect(Math.abs(got - want)).toBeLessThan(4 * Math.sqrt((want * (1 - want)) / draws));
      }
      expect(Math.abs(f.meanRank - (e.meanRank[id] as number))).toBeLessThan(4 / Math.sqrt(draws));
    }
  });

  it('clusteredMean = statsmodels OLS cluster, use_t=True', () => {
    for (const c of REF.clusteredMean.cases) {
      const r = clusteredMean(c.values, c.clusters);
      close(r.mean, c.mean);
      close(r.se, c.se);
      close(r.t, c.t, 1e-8);
      close(r.p, c.p, 1e-8);
      expect(r.df).toBe(c.df);
      close(r.interval[0], c.lo, 1e-8);
      close(r.interval[1], c.hi, 1e-8);
    }
  });

  it('derSimonianLaird = statsmodels combine_effects(method_re="dl"), τ² truncated at 0', () => {
    for (const c of REF.derSimonianLaird.cases) {
      const r = derSimonianLaird(c.y, c.v);
      close(r.tau2, c.tau2);
      close(r.Q, c.Q);
      close(r.I2, c.I2);
      close(r.pQ, c.pQ, 1e-8);
      close(r.muFE, c.muFE);
      close(r.seFE, c.seFE);
      close(r.muRE, c.muRE);
      close(r.seRE, c.seRE);
    }
  });

  it('empiricalBayesShrink = precision-weighted normal posterior', () => {
    for (const c of REF.shrinkage.cases) {
      const r = empiricalBayesShrink({ mean: c.mean, n: c.n }, c.sigma2, c.tau2, c.mu);
      close(r.B, c.B, 1e-12);
      close(r.shrunk, c.shrunk, 1e-12);
      close(r.posteriorSd, c.posteriorSd, 1e-12);
    }
  });

  it('pooledWithinVariance = statsmodels OLS y ~ C(g) mse_resid', () => {
    const c = REF.pooledWithin;
    const r = pooledWithinVariance(c.groups);
    close(r.sigma2, c.sigma2, 1e-12);
    close(r.ss, c.ss, 1e-12);
    expect(r.df).toBe(c.df);
  });

  it('samplingFunnel = scipy.stats.halfnorm.mean', () => {
    const pts = samplingFunnel(REF.samplingFunnel.points.map((p) => p.n));
    REF.samplingFunnel.points.forEach((want, i) => {
      close(pts[i]?.marginSe, want.marginSe, 1e-12);
      close(pts[i]?.expectedAbsMarginError, want.expectedAbsMarginError, 1e-12);
      close(pts[i]?.marginMoe95, want.marginMoe95, 1e-9);
    });
    const d = REF.samplingFunnel.deff;
    close(samplingFunnel([d.n], { deff: d.deff })[0]?.expectedAbsMarginError, d.expectedAbsMarginError, 1e-12);
  });

  it('breakdown t intervals = scipy.stats.t.interval', () => {
    for (const c of REF.tInterval.cases) {
      const polls = c.values.map((v) => ({ signedError: v, absMarginError: Math.abs(v) }));
      const [bin] = breakdowns(polls, { kind: 'categorical', key: () => 'all' }).bins;
      close(bin?.meanSigned, c.mean, 1e-12);
      close(bin?.lo, c.lo, 1e-8);
      close(bin?.hi, c.hi, 1e-8);
    }
  });

  describe('a synthetic audit (pandas + statsmodels + scipy, independently)', () => {
    const a = REF.audit;
    const { items, field } = computeScorecards(a.polls, { minPolls: a.minPolls, seed: 1, draws: 200 });

    it('per-poll excess error', () => {
      const got = new Map(contestAdjustedExcess(a.polls).polls.map((d) => [d.index, d.excess] as const));
      a.pollExcess.forEach((want, i) => close(got.get(i) ?? null, want, 1e-12));
    });

    it('field figures, σ² and τ²', () => {
      close(field.fieldMeanAbsMarginError, a.fieldMeanAbsMarginError, 1e-12);
      expect(field.excessDroppedPolls).toBe(a.excessDroppedPolls);
      close(field.shrinkage.sigma2, a.sigma2, 1e-10);
      close(field.shrinkage.tau2, a.tau2, 1e-10);
    });

    it('every deterministic scorecard figure of every firm', () => {
      expect(items).toHaveLength(a.firms.length);
      for (const want of a.firms) {
        const got = items.find((i) => i.pollsterId === want.pollsterId);
        expect(got, `firm ${want.pollsterId}`).toBeDefined();
        if (!got) continue;
        expect([got.polls, got.contests, got.elections, got.calls, got.noCalls]).toEqual([
          want.polls,
          want.contests,
          want.elections,
          want.calls,
          want.noCalls,
        ]);
        close(got.meanAbsMarginError, want.meanAbsMarginError, 1e-12);
        close(got.meanSignedError, want.meanSignedError, 1e-12);
        close(got.rmse, want.rmse, 1e-12);
        close(got.winnerCalledRate, want.winnerCalledRate, 1e-12);
        close(got.coverageRate, want.coverageRate, 1e-12);
        close(got.shareCoverageRate, want.shareCoverageRate, 1e-12);
        close(got.disclosure, want.disclosure, 1e-12);
        if (want.meanSignedErrorInterval === null) expect(got.meanSignedErrorInterval).toBeNull();
        else {
          close(got.meanSignedErrorInterval?.[0], want.meanSignedErrorInterval[0], 1e-8);
          close(got.meanSignedErrorInterval?.[1], want.meanSignedErrorInterval[1], 1e-8);
        }
        close(got.excessError, want.excessError, 1e-12);
        expect(got.excessErrorN).toBe(want.excessErrorN);
        close(got.excessErrorShrunk, want.excessErrorShrunk, 1e-10);
        expect(got.ranked).toBe(want.ranked);
        expect(got.rank).toBe(want.rank);
      }
    });
  });
});
