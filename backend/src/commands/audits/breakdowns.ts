import type { AuditPollDto, AuditSettings } from '@veracast/shared-types';
import { MetricInputError } from '../../analysis/errors';
import { breakdowns, clusteredMean, DAYS_OUT_BINS, SAMPLE_SIZE_BINS, samplingFunnel, tInterval, UNDECIDED_BINS, type Breakdown } from '../../analysis/ranking';
import { historicalAverageInterval, qqPoints, tooCloseToCall } from '../../analysis/shared-error';
import type { ElectionRow } from '../../queries/archive';
import { groupBy } from '../../analysis/group-by';
import { usedPolls } from './compute';

type Computable = AuditPollDto & { marginError: number; absMarginError: number };
const computable = (xs: readonly AuditPollDto[]) => xs.filter((i): i is Computable => i.error === null && i.marginError !== null && i.absMarginError !== null);
const asBreakdownPolls = (xs: readonly Computable[]) => xs.map((i) => ({ ...i, signedError: i.marginError }));
const safe = <T,>(f: () => T): T | null => {
  try {
    return f();
  } catch (err) {
    if (err instanceof MetricInputError) return null;
    throw err;
  }
};

/**
 * "Where did the error come from": binned error by days out (every computable poll: the
 * late-movement view), population, mode, sponsor type, undecided share and sample size (over the
 * polls the audit uses), a sampling-only funnel, a Q–Q of signed errors and per-election means.
 * Signed errors are margin errors oriented by the contest's reference pair.
 */
export function auditBreakdowns(items: readonly AuditPollDto[], settings: AuditSettings, partisan: readonly string[]) {
  const all = computable(items);
  const used = computable(usedPolls(items, settings));
  const usedSet = new Set(used);
  const polls = asBreakdownPolls(used);
  const categorical = (key: (p: Computable) => string) => safe(() => breakdowns(polls, { kind: 'categorical', key }));
  // Numeric bins also carry their bounds (min included, max excluded; null for an open end).
  const numeric = (xs: ReturnType<typeof asBreakdownPolls>, key: (p: Computable) => number | null, bins: typeof DAYS_OUT_BINS) => {
    const b = safe(() => breakdowns(xs, { kind: 'numeric', key, bins }));
    return b && { ...b, bins: b.bins.map((bin, i) => ({ ...bin, min: bins[i]!.min, max: Number.isFinite(bins[i]!.max) ? bins[i]!.max : null })) };
  };
  const ns = [...new Set(used.map((p) => p.sampleSize))].sort((a, b) => a - b);
  const funnelNs = ns.length ? [ns[0]!, ...[250, 500, 750, 1000, 1500, 2000, 3000, 5000].filter((n) => n > ns[0]! && n < ns[ns.length - 1]!), ns[ns.length - 1]!] : [];
  const byElection: Record<string, unknown>[] = [];
  for (const key of settings.electionKeys) {
    const xs = used.filter((p) => p.electionKey === key);
    const oriented = xs.filter((p) => p.refBasis === 'blocs');
    const cm = oriented.length >= 2 ? safe(() => clusteredMean(oriented.map((p) => p.marginError), oriented.map((p) => p.contestKey))) : null;
    const abs = xs.map((p) => p.absMarginError);
    byElection.push({
      electionKey: key, n: xs.length, meanAbs: abs.length ? abs.reduce((a, b) => a + b, 0) / abs.length : null,
      meanSigned: cm?.mean ?? (oriented.length === 1 ? oriented[0]!.marginError : null), lo: cm?.interval[0] ?? null, hi: cm?.interval[1] ?? null,
      // t interval of the mean absolute error (polls taken as independent; too narrow when a contest has several polls).
      absInterval: abs.length >= 2 ? safe(() => tInterval(abs)) : null,
    });
  }
  return {
    usedPolls: used.length,
    daysOut: {
      points: all.map((p) => ({ pollKey: p.pollKey, pollster: p.pollster, daysOut: p.daysOut, signedError: p.marginError, absError: p.absMarginError, used: usedSet.has(p) })),
      bins: numeric(asBreakdownPolls(all), (p) => p.daysOut, DAYS_OUT_BINS),
    },
    population: categorical((p) => p.population),
    mode: categorical((p) => p.mode),
    sponsor: categorical((p) => (p.sponsorType && partisan.includes(p.sponsorType) ? 'partisan' : 'not partisan')),
    undecided: numeric(polls, (p) => p.undecidedShare, UNDECIDED_BINS),
    sampleSize: {
      points: used.map((p) => ({ pollKey: p.pollKey, n: p.sampleSize, absError: p.absMarginError })),
      bins: numeric(polls, (p) => p.sampleSize, SAMPLE_SIZE_BINS),
      funnel: funnelNs.length ? safe(() => samplingFunnel(funnelNs)) : null,
    },
    qq: used.length >= 3 ? safe(() => qqPoints(used.map((p) => p.marginError))) : null,
    byElection,
  } satisfies Record<string, unknown> & { population: Breakdown | null };
}

/**
 * Across elections: each election's shared miss (mean signed error with its CR1 interval), and the
 * archive's own estimate of the total error of a final poll average: per contest, the plain average
 * of the used polls' margins minus the certified margin; the interval history supports is the larger
 * of ±1.96·RMSE and the 95th percentile of |miss| (historicalAverageInterval). Contests whose average
 * margin lay inside it are "too close for polls to call".
 */
export function auditHistory(items: readonly AuditPollDto[], settings: AuditSettings, elections: readonly ElectionRow[]) {
  const used = computable(usedPolls(items, settings)).filter((p) => p.resultA !== null && p.resultB !== null);
  const contests = groupBy(used, (p) => p.contestKey);
  const averages = [...contests.entries()].map(([contestKey, ps]) => {
    const miss = ps.reduce((a, p) => a + p.marginError, 0) / ps.length;
    const certified = ps[0]!.resultA! - ps[0]!.resultB!;
    const naiveSe = Math.sqrt(ps.reduce((a, p) => a + (p.nEff ? (10_000 * (p.pollA! / 100 + p.pollB! / 100 - ((p.pollA! - p.pollB!) / 100) ** 2)) / p.nEff : 0), 0)) / ps.length;
    return { contestKey, electionKey: ps[0]!.electionKey, k: ps.length, averageMargin: certified + miss, certifiedMargin: certified, miss, naiveHalfWidth: 1.959964 * naiveSe };
  });
  const interval = averages.length >= 2 ? safe(() => historicalAverageInterval(averages.map((a) => a.miss))) : null;
  const flagged = averages.map((a) => ({
    ...a,
    tooClose: interval ? tooCloseToCall(a.averageMargin, interval) : null,
    calledRight: Math.sign(a.averageMargin) === Math.sign(a.certifiedMargin) && a.averageMargin !== 0,
  }));
  const close = flagged.filter((a) => a.tooClose);
  const naive = averages.length ? averages.reduce((s, a) => s + a.naiveHalfWidth, 0) / averages.length : null;
  return {
    elections: elections.map((e) => {
      const oriented = used.filter((p) => p.electionKey === e.key && p.refBasis === 'blocs');
      const cm = oriented.length >= 2 ? safe(() => clusteredMean(oriented.map((p) => p.marginError), oriented.map((p) => p.contestKey))) : null;
      return { electionKey: e.key, name: e.name, date: e.date, polls: oriented.length, meanSignedError: cm?.mean ?? null, lo: cm?.interval[0] ?? null, hi: cm?.interval[1] ?? null };
    }).sort((a, b) => (a.date < b.date ? -1 : 1)),
    averageInterval: interval,
    naiveHalfWidth: naive,
    method: 'Per contest, the miss of the plain average of the polls the audit uses (average margin minus certified margin). The interval history supports is the larger of ±1.96·RMSE of those misses and their 95th percentile of |miss|; the naive interval is ±1.96 times the sampling standard error of the average, taking polls as independent.',
    contests: flagged,
    tooCloseCount: close.length,
    tooCloseCalledRight: close.filter((a) => a.calledRight).length,
  };
}
