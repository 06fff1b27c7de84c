/**
 * The whole shared-error analysis of one election, in the shape of
 * `GET /api/v1/audits/:id/shared-error` (SPEC §7), from plain poll rows.
 *
 * Unlike the functions it calls, it never throws on thin data: whatever cannot be computed is
 * null (or an empty list) and `warnings` says why in plain words. No field is ever NaN or
 * Infinity.
 */
import { MetricInputError } from '../errors';
import { andersonDarling, jarqueBera, qqPoints, shapiroWilk, SHAPIRO_MAX_N, type QqPoint } from './normality';
import { clusteredMean, type ClusteredMeanResult } from './clustered-mean';
import { icc1, type Icc1Result } from './icc';
import {
  contestBiasAndHouseEffects,
  varianceDecomposition,
  type ContestBias,
  type FirmContestError,
  type HouseEffect,
  type VarianceComponents,
} from './house-effects';
import {
  contestAverageSummary,
  errorStructureFromIcc,
  pollAverageInterval,
  type ErrorStructure,
} from './effective-polls';
import { pairwiseFirmCorrelations, type FirmPairCorrelation } from './pairwise';
import { allEqual, groupBy, meanOf } from './internal';
import { Z95 } from '../distributions';

/** One poll of the election, as the analysis reads it. */
export interface SharedErrorPoll {
  readonly pollKey: string;
  readonly contestKey: string;
  /** Polling firm. */
  readonly firm: string;
  /** Signed margin error (points), oriented by the election's blocs. */
  readonly signedError: number;
  /** Sampling variance of the poll's margin (points²), from its effective n; > 0. */
  readonly samplingVariance: number;
  /** Certified margin A − B of the contest (points). */
  readonly certifiedMargin: number;
}

/** Input of {@link computeSharedError}. */
export interface SharedErrorInput {
  /** The election's polls (normally the audit's final polls in the window). */
  readonly polls: readonly SharedErrorPoll[];
  /** Fewest common contests for a pair of firms to be correlated (default 5). */
  readonly minCommon?: number;
}

/** Per-contest detail: the poll average and the intervals it carried. */
export interface ContestDetail {
  readonly contestKey: string;
  /** Polls in the contest. */
  readonly k: number;
  /** Mean signed error of the contest's polls = miss of their plain average (points). */
  readonly meanError: number;
  /** Certified margin of the contest (points); null when the polls disagree on it or it is missing. */
  readonly certifiedMargin: number | null;
  /** Plain average of the polls' margins = certified margin + mean error; null with it. */
  readonly averageMargin: number | null;
  /** √(Σv)/k; null when a poll lacks a positive sampling variance. */
  readonly naiveSe: number | null;
  /** √[(σ²/k)(1 + (k − 1)ρ)] from the election's ICC fit; null when it is not available. */
  readonly adjustedSe: number | null;
  /** k/[1 + (k − 1)ρ]; null with adjustedSe. */
  readonly nEff: number | null;
  /** DL excess variance over sampling variance (points²); null when k < 2 or variances missing. */
  readonly tau2: number | null;
  readonly q: number | null;
  readonly qP: number | null;
  readonly i2: number | null;
  /** Whether the naive 95% interval of the average held the certified margin. */
  readonly naiveCovered: boolean | null;
  /** Whether the adjusted 95% interval of the average held the certified margin. */
  readonly adjustedCovered: boolean | null;
}

/** Result of {@link computeSharedError}; see SPEC §7. Points unless stated. */
export interface SharedErrorAnalysis {
  /** Polls analysed (after leaving out unusable rows, which `warnings` lists). */
  readonly polls: number;
  /** Contests with at least one poll. */
  readonly contests: number;
  /** Firms with at least one poll. */
  readonly firms: number;
  readonly meanSignedError: number | null;
  /** CR1 standard error of the mean, contests as clusters. */
  readonly clusteredSe: number | null;
  /** Contests − 1. */
  readonly df: number | null;
  readonly t: number | null;
  /** Two-sided p on df degrees of freedom (Student t reference). */
  readonly p: number | null;
  readonly ciLow: number | null;
  readonly ciHigh: number | null;
  /** ICC(1) by ANOVA moments (may be negative). */
  readonly icc: number | null;
  readonly iccF: number | null;
  readonly iccP: number | null;
  /** Between- and within-contest df of the F test. */
  readonly iccDf: readonly [number, number] | null;
  /** σ_b² and σ_w² (points²) used for the adjusted intervals. */
  readonly errorStructure: ErrorStructure | null;
  readonly shapiroW: number | null;
  readonly shapiroP: number | null;
  readonly jarqueBera: number | null;
  readonly jarqueBeraP: number | null;
  /** Unadjusted A² (as statsmodels `normal_ad` returns it). */
  readonly andersonDarling: number | null;
  /** p from the adjusted A²(1 + 0.75/n + 2.25/n²). */
  readonly andersonDarlingP: number | null;
  /** Shares of error variance (each in [0, 1], summing to 1): contest, house, noise. */
  readonly varianceSplit: VarianceComponents | null;
  /** Raw pairwise moment estimates behind `varianceSplit` (points², may be negative). */
  readonly varianceComponents: VarianceComponents | null;
  readonly contestBias: readonly ContestBias[];
  readonly houseEffects: readonly HouseEffect[];
  readonly contestsDetail: readonly ContestDetail[];
  readonly pairs: readonly FirmPairCorrelation[];
  /** Normal Q–Q points of all errors (Blom positions); empty when not computable. */
  readonly qq: readonly QqPoint[];
  /** Plain-English reasons for every null above, and rows left out. */
  readonly warnings: readonly string[];
}

const MAX_LISTED_KEYS = 10;

function listKeys(keys: readonly string[]): string {
  const shown = keys.slice(0, MAX_LISTED_KEYS).join(', ');
  return keys.length > MAX_LISTED_KEYS ? `${shown} and ${keys.length - MAX_LISTED_KEYS} more` : shown;
}

const isKey = (x: unknown): x is string => typeof x === 'string' && x.length > 0;
const isFiniteNumber = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);
const plural = (n: number, one: string, many: string): string => (n === 1 ? one : many);

/** Runs `f`, turning a MetricInputError into a warning and null; other errors propagate. */
function attempt<T>(warnings: string[], prefix: string, f: () => T): T | null {
  try {
    return f();
  } catch (e) {
    if (e instanceof MetricInputError) {
      warnings.push(`${prefix}: ${e.message}.`);
      return null;
    }
    throw e;
  }
}

/**
 * Shared-error analysis of one election's polls (SPEC §5 and §7; METHODS §5–6).
 *
 * Steps: leave out rows without a usable contest, firm or signed error (warned); mean signed
 * error with a CR1 contest-clustered SE and a t test on contests − 1 df; ICC(1) by ANOVA moments
 * of errors grouped by contest; normality of all errors (Shapiro–Wilk, Jarque–Bera,
 * Anderson–Darling) with Q–Q points; contest bias and house effects (plain and leave-one-out);
 * the pairwise-moment split of error variance into contest, house and noise; per contest the
 * naive and adjusted SE of the poll average, n_eff and the DL excess variance; pairwise firm
 * correlations (raw and with the other firms' contest bias removed).
 *
 * @param input the election's polls and the pair threshold.
 * @returns the SPEC §7 shape; thin data gives nulls and warnings, never a throw, NaN or Infinity.
 */
export function computeSharedError(input: SharedErrorInput): SharedErrorAnalysis {
  const warnings: string[] = [];
  const rows: readonly SharedErrorPoll[] = Array.isArray(input?.polls) ? input.polls : [];
  if (!Array.isArray(input?.polls)) warnings.push('No poll list was given.');

  let minCommon = 5;
  if (input?.minCommon !== undefined) {
    if (Number.isInteger(input.minCommon) && input.minCommon >= 3) minCommon = input.minCommon;
    else warnings.push(`minCommon must be an integer of at least 3; 5 was used instead of ${String(input.minCommon)}.`);
  }

  // 1. Usable rows.
  const seen = new Set<string>();
  const unusable: string[] = [];
  const duplicates: string[] = [];
  const polls: SharedErrorPoll[] = [];
  rows.forEach((row, i) => {
    const label = isKey(row?.pollKey) ? row.pollKey : `#${i + 1}`;
    if (!row || !isKey(row.contestKey) || !isKey(row.firm) || !isFiniteNumber(row.signedError)) {
      unusable.push(label);
      return;
    }
    if (isKey(row.pollKey)) {
      if (seen.has(row.pollKey)) {
        duplicates.push(row.pollKey);
        return;
      }
      seen.add(row.pollKey);
    }
    polls.push(row);
  });
  if (unusable.length > 0) {
    warnings.push(
      `${unusable.length} ${plural(unusable.length, 'poll was', 'polls were')} left out for lacking a contest, a firm or a finite signed error: ${listKeys(unusable)}.`,
    );
  }
  if (duplicates.length > 0) {
    warnings.push(`Repeated poll keys were counted once: ${listKeys(duplicates)}.`);
  }

  const n = polls.length;
  const errors = polls.map((p) => p.signedError);
  const byContest = groupBy(polls, (p) => p.contestKey);
  const g = byContest.size;
  const firmCount = new Set(polls.map((p) => p.firm)).size;
  const firmErrors: FirmContestError[] = polls.map((p) => ({
    contestKey: p.contestKey,
    firm: p.firm,
    error: p.signedError,
  }));

  if (n === 0) {
    warnings.push('There are no polls with a usable signed error, so nothing could be computed.');
    return emptyAnalysis(warnings);
  }
  const everyErrorEqual = allEqual(errors);
  if (everyErrorEqual && n > 1) {
    warnings.push(
      `All ${n} errors are equal (${errors[0]} pts): tests that need variation between polls are not computed.`,
    );
  }

  // 2. Mean signed error with contest-clustered SE.
  let clustered: ClusteredMeanResult | null = null;
  if (g < 2) {
    warnings.push(
      'Only one contest has polls: the mean error cannot be tested with contest-clustered standard errors, which need at least 2 contests.',
    );
  } else if (!everyErrorEqual) {
    clustered = attempt(warnings, 'Clustered standard error not computed', () =>
      clusteredMean(errors, polls.map((p) => p.contestKey)),
    );
  }

  // 3. ICC(1) of errors by contest.
  let icc: Icc1Result | null = null;
  if (g < 2) {
    warnings.push('The intraclass correlation needs polls in at least 2 contests.');
  } else if (n - g < 1) {
    warnings.push(
      'Every contest has a single poll, so agreement within contests (intraclass correlation) cannot be estimated.',
    );
  } else if (!everyErrorEqual) {
    icc = attempt(warnings, 'Intraclass correlation not computed', () =>
      icc1([...byContest.values()].map((rs) => rs.map((r) => r.signedError))),
    );
  }
  if (icc !== null && icc.icc < 0) {
    warnings.push(
      'The intraclass correlation is negative: polls of one contest agreed less than polls of different contests, so no shared variance is assumed (ρ = 0) for the adjusted intervals.',
    );
  }
  const structure = icc === null ? null : errorStructureFromIcc(icc);

  // 4. Normality.
  let shapiro: ReturnType<typeof shapiroWilk> | null = null;
  let jb: ReturnType<typeof jarqueBera> | null = null;
  let ad: ReturnType<typeof andersonDarling> | null = null;
  let qq: QqPoint[] = [];
  if (n < 3) {
    warnings.push(`Only ${n} ${plural(n, 'error', 'errors')}: the normality checks and the Q–Q plot need at least 3.`);
  } else if (!everyErrorEqual) {
    if (n > SHAPIRO_MAX_N) {
      warnings.push(`Shapiro–Wilk is not computed for more than ${SHAPIRO_MAX_N} errors.`);
    } else {
      shapiro = attempt(warnings, 'Shapiro–Wilk not computed', () => shapiroWilk(errors));
    }
    jb = attempt(warnings, 'Jarque–Bera not computed', () => jarqueBera(errors));
    ad = attempt(warnings, 'Anderson–Darling not computed', () => andersonDarling(errors));
    qq = attempt(warnings, 'Q–Q points not computed', () => qqPoints(errors)) ?? [];
  }

  // 5. Contest bias, house effects and the variance split.
  const effects = contestBiasAndHouseEffects(firmErrors);
  const split = everyErrorEqual
    ? null
    : attempt(warnings, 'The split of error variance into contest, house and noise parts was not computed', () =>
        varianceDecomposition(firmErrors),
      );

  // 6. Per-contest averages.
  const singletons: string[] = [];
  const missingVariance: string[] = [];
  const conflictingMargin: string[] = [];
  const contestsDetail: ContestDetail[] = [];
  for (const [contestKey, cps] of byContest) {
    const k = cps.length;
    if (k === 1) singletons.push(contestKey);
    const margins = cps.map((p) => p.certifiedMargin);
    const firstMargin = margins[0];
    const certifiedMargin =
      isFiniteNumber(firstMargin) && margins.every((m) => m === firstMargin) ? firstMargin : null;
    if (certifiedMargin === null) conflictingMargin.push(contestKey);
    const variancesOk = cps.every((p) => isFiniteNumber(p.samplingVariance) && p.samplingVariance > 0);
    if (!variancesOk) missingVariance.push(contestKey);
    const meanError = meanOf(cps.map((p) => p.signedError));
    const summary = variancesOk
      ? contestAverageSummary(
          cps.map((p) => ({ error: p.signedError, samplingVariance: p.samplingVariance })),
          structure,
        )
      : null;
    let adjustedSe = summary?.adjustedSe ?? null;
    let nEff = summary?.nEff ?? null;
    if (summary === null && structure !== null) {
      const total = structure.sharedVariance + structure.withinVariance;
      const interval = pollAverageInterval(Math.sqrt(total), k, structure.sharedVariance / total);
      adjustedSe = interval.adjustedSe;
      nEff = interval.nEff;
    }
    contestsDetail.push({
      contestKey,
      k,
      meanError,
      certifiedMargin,
      averageMargin: certifiedMargin === null ? null : certifiedMargin + meanError,
      naiveSe: summary?.naiveSe ?? null,
      adjustedSe,
      nEff,
      tau2: summary?.tau2 ?? null,
      q: summary?.q ?? null,
      qP: summary?.qP ?? null,
      i2: summary?.i2 ?? null,
      naiveCovered: summary?.naiveCovered ?? null,
      adjustedCovered: adjustedSe === null ? null : Math.abs(meanError) <= Z95 * adjustedSe,
    });
  }
  if (singletons.length > 0) {
    warnings.push(
      `${singletons.length} ${plural(singletons.length, 'contest has', 'contests have')} a single poll, so excess variance (τ², Q, I²) is not computed for ${plural(singletons.length, 'it', 'them')}: ${listKeys(singletons)}.`,
    );
  }
  if (missingVariance.length > 0) {
    warnings.push(
      `Some polls lack a positive sampling variance, so naive intervals and excess variance are not computed for: ${listKeys(missingVariance)}.`,
    );
  }
  if (conflictingMargin.length > 0) {
    warnings.push(
      `The certified margin is missing or differs between polls of: ${listKeys(conflictingMargin)}; their average margin is not shown.`,
    );
  }
  if (structure === null) {
    warnings.push(
      'Adjusted intervals and the effective number of polls need the intraclass correlation, which could not be estimated.',
    );
  }

  // 7. Pairs of firms.
  const pairs = pairwiseFirmCorrelations(firmErrors, { minCommon });
  if (firmCount < 2) {
    warnings.push('Only one firm polled: there are no pairs of firms to correlate.');
  } else if (pairs.every((pr) => pr.insufficient)) {
    warnings.push(
      `No pair of firms polled at least ${minCommon} contests in common, so no firm-pair correlation is computed.`,
    );
  }

  return {
    polls: n,
    contests: g,
    firms: firmCount,
    meanSignedError: meanOf(errors),
    clusteredSe: clustered?.se ?? null,
    df: clustered?.df ?? null,
    t: clustered?.t ?? null,
    p: clustered?.p ?? null,
    ciLow: clustered?.ciLow ?? null,
    ciHigh: clustered?.ciHigh ?? null,
    icc: icc?.icc ?? null,
    iccF: icc?.f ?? null,
    iccP: icc?.p ?? null,
    iccDf: icc === null ? null : [icc.dfBetween, icc.dfWithin],
    errorStructure: structure,
    shapiroW: shapiro?.w ?? null,
    shapiroP: shapiro?.p ?? null,
    jarqueBera: jb?.statistic ?? null,
    jarqueBeraP: jb?.p ?? null,
    andersonDarling: ad?.statistic ?? null,
    andersonDarlingP: ad?.p ?? null,
    varianceSplit: split?.shares ?? null,
    varianceComponents: split?.components ?? null,
    contestBias: effects.contestBias,
    houseEffects: effects.houseEffects,
    contestsDetail,
    pairs,
    qq,
    warnings,
  };
}

function emptyAnalysis(warnings: readonly string[]): SharedErrorAnalysis {
  return {
    polls: 0,
    contests: 0,
    firms: 0,
    meanSignedError: null,
    clusteredSe: null,
    df: null,
    t: null,
    p: null,
    ciLow: null,
    ciHigh: null,
    icc: null,
    iccF: null,
    iccP: null,
    iccDf: null,
    errorStructure: null,
    shapiroW: null,
    shapiroP: null,
    jarqueBera: null,
    jarqueBeraP: null,
    andersonDarling: null,
    andersonDarlingP: null,
    varianceSplit: null,
    varianceComponents: null,
    contestBias: [],
    houseEffects: [],
    contestsDetail: [],
    pairs: [],
    qq: [],
    warnings,
  };
}
