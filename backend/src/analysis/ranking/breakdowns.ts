/**
 * Error breakdowns by a numeric or categorical key, and the sampling-only
 * funnel (SPEC §5 "Breakdowns of error").
 */
import { mean, sampleStandardDeviation } from 'simple-statistics';
import { studentTQuantile, Z95 } from '../distributions';
import { MetricInputError, requireFinite, requirePositive } from '../errors';
import type { Interval } from './types';
import { requireArray, requireKey, requireNonNegative } from './validate';

/** The two error figures a breakdown needs from a poll (points). */
export interface BreakdownPoll {
  /** Bloc-oriented margin error (points). */
  readonly signedError: number;
  /** |margin error| (points), >= 0. */
  readonly absMarginError: number;
}

/**
 * A half-open numeric bin [min, max): `min` inclusive, `max` exclusive
 * (`Infinity` for an open top). Labels name whole units, e.g. "4–7" days is
 * [4, 8), so a fieldwork midpoint 7.5 days out falls in "4–7".
 */
export interface NumericBin {
  readonly label: string;
  readonly min: number;
  readonly max: number;
}

/** Days out (election date − fieldwork midpoint): 0–3, 4–7, 8–14, 15–21, 22+. */
export const DAYS_OUT_BINS: readonly NumericBin[] = Object.freeze([
  { label: '0–3', min: 0, max: 4 },
  { label: '4–7', min: 4, max: 8 },
  { label: '8–14', min: 8, max: 15 },
  { label: '15–21', min: 15, max: 22 },
  { label: '22+', min: 22, max: Infinity },
]);

/** Sample size: under 500, 500–999, 1000–1999, 2000+. */
export const SAMPLE_SIZE_BINS: readonly NumericBin[] = Object.freeze([
  { label: '<500', min: 0, max: 500 },
  { label: '500–999', min: 500, max: 1000 },
  { label: '1000–1999', min: 1000, max: 2000 },
  { label: '2000+', min: 2000, max: Infinity },
]);

/** Undecided share in points: [0, 5), [5, 10), [10, 15), 15+. */
export const UNDECIDED_BINS: readonly NumericBin[] = Object.freeze([
  { label: '0–5', min: 0, max: 5 },
  { label: '5–10', min: 5, max: 10 },
  { label: '10–15', min: 10, max: 15 },
  { label: '15+', min: 15, max: Infinity },
]);

export type BreakdownSpec<P> =
  | {
      readonly kind: 'numeric';
      /** The poll's value (e.g. days out); null = unknown (counted in `excluded`). */
      readonly key: (poll: P) => number | null;
      /** Non-overlapping bins, in display order. */
      readonly bins: readonly NumericBin[];
    }
  | {
      readonly kind: 'categorical';
      /** The poll's category (e.g. mode); null = unknown (counted in `excluded`). */
      readonly key: (poll: P) => string | null;
      /** Categories shown first, in this order (even when empty); others follow sorted. */
      readonly order?: readonly string[];
    };

/** One bin of a breakdown; every figure in points. */
export interface BreakdownBin {
  readonly label: string;
  readonly n: number;
  /** Mean |margin error|; null when n = 0. */
  readonly meanAbs: number | null;
  /** Mean signed error; null when n = 0. */
  readonly meanSigned: number | null;
  /** 95% t interval of the mean SIGNED error (lo, hi); null when n < 2. */
  readonly lo: number | null;
  readonly hi: number | null;
  /** 95% t interval of the mean ABSOLUTE error; null when n < 2. */
  readonly absInterval: Interval | null;
}

export interface Breakdown {
  readonly bins: readonly BreakdownBin[];
  /** Polls with a null key or a value in no bin. */
  readonly excluded: number;
}

/** Mean ± t_{0.975, n−1}·s/√n (s with the n − 1 denominator); null for n < 2. */
export function tInterval(xs: readonly number[]): Interval | null {
  if (xs.length < 2) return null;
  const m = mean(xs);
  const half = (studentTQuantile(0.975, xs.length - 1) * sampleStandardDeviation(xs)) / Math.sqrt(xs.length);
  return [m - half, m + half];
}

function summarise(label: string, polls: readonly BreakdownPoll[]): BreakdownBin {
  if (polls.length === 0) {
    return { label, n: 0, meanAbs: null, meanSigned: null, lo: null, hi: null, absInterval: null };
  }
  const signed = polls.map((p) => p.signedError);
  const abs = polls.map((p) => p.absMarginError);
  const si = tInterval(signed);
  return {
    label,
    n: polls.length,
    meanAbs: mean(abs),
    meanSigned: mean(signed),
    lo: si ? si[0] : null,
    hi: si ? si[1] : null,
    absInterval: tInterval(abs),
  };
}

/**
 * Mean absolute and signed margin error per bin, with 95% Student t intervals
 * (mean ± t_{0.975, n−1}·s/√n, s with the n − 1 denominator; null for n < 2).
 *
 * Caution: the intervals treat polls as independent. Polls of one contest share
 * its error, so when a bin holds several polls of the same contest the interval
 * is too narrow; the per-election shared-error analysis clusters by contest.
 *
 * @param polls polls with finite `signedError` and `absMarginError` >= 0 (points); not mutated.
 * @param spec numeric `{ kind, key, bins }` (half-open bins, min < max, no overlap)
 *   or categorical `{ kind, key, order? }`.
 * @throws MetricInputError `polls` (not an array), `polls[i].signedError`,
 *   `polls[i].absMarginError`, `polls[i].key` (key returned a non-finite number or
 *   an empty string), `spec`, `spec.bins` (empty), `spec.bins[b]` (bad label, min >= max,
 *   overlaps the previous bin), `spec.order[i]` (empty or repeated).
 * @returns bins in display order and the count of polls left out.
 * @example
 * breakdowns([{ signedError: 1, absMarginError: 1, days: 2 }, { signedError: -3, absMarginError: 3, days: 3 }],
 *   { kind: 'numeric', key: (p) => p.days, bins: DAYS_OUT_BINS }).bins[0];
 * // → { label: '0–3', n: 2, meanAbs: 2, meanSigned: -1, lo: -26.41…, hi: 24.41…, absInterval: [-10.71…, 14.71…] }
 */
export function breakdowns<P extends BreakdownPoll>(polls: readonly P[], spec: BreakdownSpec<P>): Breakdown {
  requireArray('polls', polls, 0);
  polls.forEach((p, i) => {
    requireFinite(`polls[${i}].signedError`, p.signedError);
    requireNonNegative(`polls[${i}].absMarginError`, p.absMarginError);
  });
  if (typeof spec !== 'object' || spec === null || typeof spec.key !== 'function') {
    throw new MetricInputError('spec', 'must be { kind, key, ... } with a key function');
  }
  if (spec.kind === 'numeric') {
    requireArray('spec.bins', spec.bins, 1);
    spec.bins.forEach((b, i) => {
      requireKey(`spec.bins[${i}].label`, b.label);
      requireFinite(`spec.bins[${i}].min`, b.min);
      if (typeof b.max !== 'number' || Number.isNaN(b.max) || !(b.max > b.min)) {
        throw new MetricInputError(`spec.bins[${i}].max`, 'must be greater than min');
      }
      spec.bins.slice(0, i).forEach((a) => {
        if (b.min < a.max && a.min < b.max) {
          throw new MetricInputError(`spec.bins[${i}]`, 'must not overlap another bin');
        }
      });
    });
    const members = spec.bins.map((): P[] => []);
    let excluded = 0;
    polls.forEach((p, i) => {
      const v = spec.key(p);
      if (v === null) {
        excluded += 1;
        return;
      }
      requireFinite(`polls[${i}].key`, v);
      const at = spec.bins.findIndex((b) => v >= b.min && v < b.max);
      if (at < 0) excluded += 1;
      else (members[at] as P[]).push(p);
    });
    return { bins: spec.bins.map((b, i) => summarise(b.label, members[i] as P[])), excluded };
  }
  if (spec.kind === 'categorical') {
    const order = spec.order ?? [];
    requireArray('spec.order', order, 0);
    const groups = new Map<string, P[]>();
    order.forEach((c, i) => {
      requireKey(`spec.order[${i}]`, c);
      if (groups.has(c)) throw new MetricInputError(`spec.order[${i}]`, 'must not repeat a category');
      groups.set(c, []);
    });
    let excluded = 0;
    const extra: string[] = [];
    polls.forEach((p, i) => {
      const c = spec.key(p);
      if (c === null) {
        excluded += 1;
        return;
      }
      requireKey(`polls[${i}].key`, c);
      const list = groups.get(c);
      if (list) list.push(p);
      else {
        groups.set(c, [p]);
        extra.push(c);
      }
    });
    extra.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
    return { bins: [...order, ...extra].map((c) => summarise(c, groups.get(c) as P[])), excluded };
  }
  throw new MetricInputError('spec.kind', "must be 'numeric' or 'categorical'");
}

/** One point of the sampling-only funnel. */
export interface FunnelPoint {
  /** Sample size n. */
  readonly n: number;
  /** Effective sample size n / deff. */
  readonly nEff: number;
  /** SE of the margin p_A − p_B in points for a 50/50 race: 100·√(1/n_eff). */
  readonly marginSe: number;
  /** Expected |margin error| under sampling alone: marginSe·√(2/π), points. */
  readonly expectedAbsMarginError: number;
  /** 95% margin of error of the margin: z·marginSe, points. */
  readonly marginMoe95: number;
}

/**
 * Expected mean absolute margin error from sampling alone, for a 50/50 two-option
 * race, at each sample size — the floor that poll errors are compared with.
 *
 * One multinomial sample (METHODS §5): Var(p̂_A − p̂_B) = [p_A + p_B − (p_A − p_B)²]/n,
 * which is 1/n at p_A = p_B = 0.5; in points σ = 100/√n_eff with n_eff = n/deff.
 * With the margin error X ~ Normal(0, σ²) (large-n approximation), |X| is
 * half-normal and E|X| = σ·√(2/π) ≈ 0.7979·σ.
 *
 * @param nValues sample sizes, each finite and > 0 (need not be integers: n_eff).
 * @param options `deff`: design effect, > 0 (default 1); n_eff = n/deff.
 * @throws MetricInputError `nValues` (not an array or empty), `nValues[i]` (not > 0),
 *   `options.deff` (not > 0).
 * @returns one point per n, in input order.
 * @example
 * samplingFunnel([1000])[0];
 * // → { n: 1000, nEff: 1000, marginSe: 3.162278…, expectedAbsMarginError: 2.523133…, marginMoe95: 6.197950… }
 */
export function samplingFunnel(
  nValues: readonly number[],
  options: { readonly deff?: number } = {},
): FunnelPoint[] {
  requireArray('nValues', nValues, 1);
  nValues.forEach((n, i) => requirePositive(`nValues[${i}]`, n));
  const deff = options.deff ?? 1;
  requirePositive('options.deff', deff);
  return nValues.map((n) => {
    const nEff = n / deff;
    const marginSe = 100 * Math.sqrt(1 / nEff);
    return {
      n,
      nEff,
      marginSe,
      expectedAbsMarginError: marginSe * Math.sqrt(2 / Math.PI),
      marginMoe95: Z95 * marginSe,
    };
  });
}
