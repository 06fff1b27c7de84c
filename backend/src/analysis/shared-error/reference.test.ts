/**
 * Checks every case of reference-data/shared-error/reference.json, written by
 * make_reference.py with numpy 1.24.2, scipy 1.10.1, statsmodels 0.13.5, pandas 1.5.3 and
 * R 4.2.2 (Debian bookworm). Each block's `call` field names the exact library call.
 */
import { describe, expect, it } from 'vitest';
import { clusteredMean } from './clustered-mean';
import { pearson, spearman } from './correlation';
import { derSimonianLaird } from './dersimonian-laird';
import { historicalAverageInterval } from './historical';
import { contestBiasAndHouseEffects, varianceDecomposition, type FirmContestError } from './house-effects';
import { icc1 } from './icc';
import { andersonDarling, jarqueBera, shapiroWilk } from './normality';
import { pairwiseFirmCorrelations } from './pairwise';
import { expectClose, readReference } from './testing';

interface Block<C> {
  readonly call: string;
  readonly cases: readonly C[];
}
type Numbers = Readonly<Record<string, number>>;
interface Reference {
  readonly versions: Readonly<Record<string, string | null>>;
  readonly clusteredMean: Block<{ name: string; values: number[]; clusters: string[]; expected: Numbers; normalReferenceP: number }>;
  readonly icc1: Block<{ name: string; groups: number[][]; expected: Numbers }>;
  readonly derSimonianLaird: Block<{ name: string; y: number[]; v: number[]; expected: Numbers }>;
  readonly correlation: Block<{ name: string; x: number[]; y: number[]; expected: Numbers }>;
  readonly normality: Block<{ name: string; x: number[]; expected: Numbers; rShapiro?: { w: number; p: number } }>;
  readonly houseEffects: Block<{
    name: string;
    polls: FirmContestError[];
    expected: {
      contestBias: { contestKey: string; bias: number }[];
      houseEffects: { firm: string; plain: number; leaveOneOut: number | null }[];
      components: Numbers;
      shares: Numbers;
      pairs: Numbers;
    };
  }>;
  readonly pairwise: {
    readonly call: string;
    readonly minCommon: number;
    readonly polls: FirmContestError[];
    readonly pairs: readonly {
      a: string;
      b: string;
      n: number;
      insufficient: boolean;
      pearson?: number;
      pearsonP?: number;
      spearman?: number;
      spearmanP?: number;
      nAdjusted?: number;
      pearsonAdjusted?: number | null;
      pearsonAdjustedP?: number | null;
    }[];
  };
  readonly historical: Block<{ name: string; misses: number[]; expected: Numbers }>;
}

const ref = readReference<Reference>();
/**
 * Tolerance against double-precision references (statsmodels, scipy except shapiro, numpy, R):
 * 1e-8. The binding limit is @stdlib's t quantile, which agrees with scipy's t.ppf to about 1e-9
 * (e.g. 2.5705818356 vs 2.5705818366 for df 5), moving interval ends by about 1e-9.
 */
const TOL = 1e-8;
const num = (o: Numbers, k: string): number => {
  const v = o[k];
  if (v === undefined) throw new Error(`reference lacks ${k}`);
  return v;
};

describe('reference.json', () => {
  it('was written by the library versions the README names', () => {
    expect(ref.versions.scipy).toBe('1.10.1');
    expect(ref.versions.statsmodels?.startsWith('0.13.5')).toBe(true);
    expect(ref.versions.R).toMatch(/^R version 4\.2/);
  });

  describe('clusteredMean vs statsmodels OLS cov_type="cluster", use_t=True', () => {
    for (const c of ref.clusteredMean.cases) {
      it(c.name, () => {
        const r = clusteredMean(c.values, c.clusters);
        for (const k of ['mean', 'se', 't', 'p', 'ciLow', 'ciHigh'] as const) expectClose(r[k], num(c.expected, k), TOL);
        expect(r.df).toBe(num(c.expected, 'df'));
        expect(Math.abs(r.p - c.normalReferenceP)).toBeGreaterThan(1e-4);
      });
    }
  });

  describe('icc1 vs scipy f_oneway and numpy moments', () => {
    for (const c of ref.icc1.cases) {
      it(c.name, () => {
        const r = icc1(c.groups);
        for (const k of ['msb', 'msw', 'n0', 'f', 'p', 'sigma2Between', 'icc'] as const) {
          expectClose(r[k], num(c.expected, k), TOL);
        }
        expect(r.dfBetween).toBe(num(c.expected, 'dfBetween'));
        expect(r.dfWithin).toBe(num(c.expected, 'dfWithin'));
      });
    }
  });

  describe('derSimonianLaird vs statsmodels combine_effects(method_re="dl") / numpy DL', () => {
    for (const c of ref.derSimonianLaird.cases) {
      it(c.name, () => {
        const r = derSimonianLaird(c.y, c.v);
        for (const k of ['q', 'qP', 'tau2', 'muFE', 'seFE', 'muRE', 'seRE', 'i2'] as const) {
          expectClose(r[k], num(c.expected, k), TOL);
        }
      });
    }
  });

  describe('pearson and spearman vs scipy pearsonr and spearmanr', () => {
    for (const c of ref.correlation.cases) {
      it(c.name, () => {
        const p = pearson(c.x, c.y);
        const s = spearman(c.x, c.y);
        expectClose(p.r, num(c.expected, 'r'), TOL);
        expectClose(p.p, num(c.expected, 'pearsonP'), TOL);
        expectClose(p.ciLow, num(c.expected, 'ciLow'), TOL);
        expectClose(p.ciHigh, num(c.expected, 'ciHigh'), TOL);
        expectClose(s.rho, num(c.expected, 'rho'), TOL);
        expectClose(s.p, num(c.expected, 'spearmanP'), TOL);
      });
    }
  });

  describe('normality vs R shapiro.test, scipy shapiro/jarque_bera and statsmodels normal_ad', () => {
    for (const c of ref.normality.cases) {
      it(`${c.name} (n = ${c.x.length})`, () => {
        const sw = shapiroWilk(c.x);
        // R computes in double precision: agreement to 1e-9.
        expect(c.rShapiro).toBeDefined();
        expectClose(sw.w, c.rShapiro?.w as number, TOL);
        expectClose(sw.p, c.rShapiro?.p as number, TOL);
        // scipy 1.10 works in single precision: 1e-5 holds up to n = 50; beyond, its own rounding
        // grows (about 4e-5 at n = 200, 1.4e-3 at n = 5000 against R), so only R is used there.
        if (c.x.length <= 50) {
          expectClose(sw.w, num(c.expected, 'shapiroW'), 1e-5);
          expectClose(sw.p, num(c.expected, 'shapiroP'), 1e-5);
        }
        const jb = jarqueBera(c.x);
        expectClose(jb.statistic, num(c.expected, 'jarqueBera'), TOL);
        expectClose(jb.p, num(c.expected, 'jarqueBeraP'), TOL);
        expectClose(jb.skewness, num(c.expected, 'skewness'), TOL);
        expectClose(jb.kurtosis, num(c.expected, 'kurtosis'), TOL);
        const ad = andersonDarling(c.x);
        // Both tails on the log scale (scipy norm.logcdf/logsf) to 1e-8; statsmodels normal_ad to
        // METHODS' 1e-6, because its log1p(−Φ) loses digits in the upper tail (3e-8 at n = 300).
        expectClose(ad.statistic, num(c.expected, 'andersonDarlingLogTail'), TOL);
        expectClose(ad.statistic, num(c.expected, 'andersonDarling'), 1e-6);
        expectClose(ad.adjusted, num(c.expected, 'andersonDarlingAdjusted'), 1e-6);
        expectClose(ad.p, num(c.expected, 'andersonDarlingP'), 1e-6);
      });
    }
  });

  describe('contest bias, house effects and variance split vs pandas and brute-force pairs', () => {
    for (const c of ref.houseEffects.cases) {
      it(c.name, () => {
        const r = contestBiasAndHouseEffects(c.polls);
        expect(r.contestBias.map((b) => b.contestKey)).toEqual(c.expected.contestBias.map((b) => b.contestKey));
        c.expected.contestBias.forEach((b, i) => expectClose(r.contestBias[i]?.bias, b.bias, TOL));
        expect(r.houseEffects.map((h) => h.firm)).toEqual(c.expected.houseEffects.map((h) => h.firm));
        c.expected.houseEffects.forEach((h, i) => {
          const got = r.houseEffects[i];
          expectClose(got?.plain, h.plain, TOL);
          if (h.leaveOneOut === null) expect(got?.leaveOneOut).toBeNull();
          else expectClose(got?.leaveOneOut, h.leaveOneOut, TOL);
        });
        const d = varianceDecomposition(c.polls);
        for (const k of ['shared', 'house', 'noise'] as const) {
          expectClose(d.components[k], num(c.expected.components, k), TOL);
          expectClose(d.shares[k], num(c.expected.shares, k), TOL);
        }
        expect(d.pairs).toEqual(c.expected.pairs);
      });
    }
  });

  describe('pairwiseFirmCorrelations vs pandas pivot + scipy', () => {
    const got = pairwiseFirmCorrelations(ref.pairwise.polls, { minCommon: ref.pairwise.minCommon });
    it('lists the same pairs', () => {
      expect(got.map((p) => [p.a, p.b, p.n, p.insufficient])).toEqual(
        ref.pairwise.pairs.map((p) => [p.a, p.b, p.n, p.insufficient]),
      );
    });
    for (const e of ref.pairwise.pairs) {
      it(`${e.a}–${e.b}`, () => {
        const g = got.find((p) => p.a === e.a && p.b === e.b);
        if (e.insufficient) {
          expect(g?.pearson).toBeNull();
          return;
        }
        expectClose(g?.pearson, e.pearson as number, TOL);
        expectClose(g?.pearsonP, e.pearsonP as number, TOL);
        expectClose(g?.spearman, e.spearman as number, TOL);
        expectClose(g?.spearmanP, e.spearmanP as number, TOL);
        expect(g?.nAdjusted).toBe(e.nAdjusted);
        if (e.pearsonAdjusted === null || e.pearsonAdjusted === undefined) expect(g?.pearsonAdjusted).toBeNull();
        else {
          expectClose(g?.pearsonAdjusted, e.pearsonAdjusted, TOL);
          expectClose(g?.pearsonAdjustedP, e.pearsonAdjustedP as number, TOL);
        }
      });
    }
  });

  describe('historicalAverageInterval vs numpy', () => {
    for (const c of ref.historical.cases) {
      it(c.name, () => {
        const r = historicalAverageInterval(c.misses);
        for (const k of ['meanMiss', 'rmse', 'rmseHalfWidth', 'empiricalHalfWidth', 'halfWidth'] as const) {
          expectClose(r[k], num(c.expected, k), TOL);
        }
      });
    }
  });
});
