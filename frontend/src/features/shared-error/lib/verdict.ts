import type { HouseEffectDto, SharedErrorAnalysisDto } from '../types';
import { fmtInterval, fmtNumber, fmtPEquals, fmtSigned, isNum } from './format';
import { reasonFor } from './reasons';

/** Significance level of the headline flag. [practice] */
export const SHARED_MISS_ALPHA = 0.05;

export type VerdictKind = 'shared' | 'mean-only' | 'not-shown' | 'untested' | 'no-data';

export interface Blocs {
  blocA: string | null;
  blocB: string | null;
}

export interface FirmTypicalError {
  firm: string;
  polls: number;
  /** Mean signed error of the election plus the firm's house effect: its miss in a typical contest. */
  error: number;
}

export interface SharedMissVerdict {
  kind: VerdictKind;
  /** One line that answers "did most firms miss the same way?". */
  title: string;
  /** How much, which way and how sure, in a sentence or two. */
  summary: string;
  /** "polls understated OAK against LAN"; null without a mean. */
  direction: string | null;
  firmsSameSign: number;
  firmsCounted: number;
}

/**
 * Each firm's error in a typical contest of the election: the mean signed error plus the firm's
 * house effect (its mean residual after each contest's shared error is taken out). This removes
 * the luck of which contests a firm happened to poll.
 */
export function firmTypicalErrors(analysis: Pick<SharedErrorAnalysisDto, 'meanSignedError' | 'houseEffects'>): FirmTypicalError[] {
  const mean = analysis.meanSignedError;
  if (!isNum(mean) || !Array.isArray(analysis.houseEffects)) return [];
  return analysis.houseEffects
    .filter((h: HouseEffectDto) => isNum(h.plain))
    .map((h) => ({ firm: h.firm, polls: h.polls, error: mean + h.plain }));
}

/** "polls understated OAK against LAN" for a negative mean signed error of OAK − LAN. */
export function describeDirection(mean: number | null, { blocA, blocB }: Blocs): string | null {
  if (!isNum(mean)) return null;
  const a = blocA ?? 'the first bloc';
  const b = blocB ?? 'the second bloc';
  if (mean > 0) return `polls overstated ${a} against ${b}`;
  if (mean < 0) return `polls understated ${a} against ${b}`;
  return 'polls leaned neither way';
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/**
 * The headline of the shared-error page. The flag is raised when the contest-clustered test says
 * the mean signed error differs from zero (p < 0.05) and more than half of the firms missed in
 * that direction in a typical contest; otherwise the page says the evidence is not there.
 */
export function sharedMissVerdict(analysis: SharedErrorAnalysisDto, blocs: Blocs): SharedMissVerdict {
  const mean = analysis.meanSignedError;
  const direction = describeDirection(mean, blocs);
  const firms = firmTypicalErrors(analysis);
  const sameSign = isNum(mean) && mean !== 0 ? firms.filter((f) => Math.sign(f.error) === Math.sign(mean)).length : 0;
  const base = { direction, firmsSameSign: sameSign, firmsCounted: firms.length };

  if (!isNum(mean) || direction === null) {
    return {
      ...base,
      kind: 'no-data',
      title: 'Not enough data to judge a shared miss',
      summary: reasonFor(analysis.warnings, 'meanTest'),
    };
  }

  const size = fmtNumber(Math.abs(mean));
  const signed = fmtSigned(mean);
  const interval = fmtInterval(analysis.ciLow, analysis.ciHigh);
  const pText = fmtPEquals(analysis.p);
  const contests = analysis.contests;
  const firmLine =
    firms.length > 0
      ? ` In a typical contest, ${sameSign} of ${firms.length} firms missed in that direction.`
      : '';

  if (!isNum(analysis.p) || interval === null || pText === null) {
    return {
      ...base,
      kind: 'untested',
      title: 'No test of a shared miss: too few contests',
      summary: `${capitalise(direction)} by ${size} points on average (mean signed error ${signed} pts), but this cannot be tested: ${reasonFor(analysis.warnings, 'meanTest')}${firmLine}`,
    };
  }

  const evidence = `mean signed error ${signed} pts; 95% interval ${interval}; ${pText}, with standard errors clustered by contest over ${contests} contests`;
  const majority = firms.length > 0 && sameSign > firms.length / 2;
  if (analysis.p < SHARED_MISS_ALPHA && majority) {
    return {
      ...base,
      kind: 'shared',
      title: 'Shared miss: most firms missed the same way',
      summary: `${capitalise(direction)} by ${size} points on the margin (${evidence}).${firmLine} Averaging these polls could not have removed this miss.`,
    };
  }
  if (analysis.p < SHARED_MISS_ALPHA) {
    return {
      ...base,
      kind: 'mean-only',
      title: 'The polls missed on average, but the firms did not mostly miss the same way',
      summary: `${capitalise(direction)} by ${size} points on the margin (${evidence}).${firmLine || ' No firm-level estimates were available.'}`,
    };
  }
  return {
    ...base,
    kind: 'not-shown',
    title: 'No clear shared miss: the evidence is not there',
    summary: `The polls' mean signed error was ${signed} pts (95% interval ${interval}; ${pText}, clustered by contest over ${contests} contests): an error of this size could come from contest-to-contest variation alone.${firmLine}`,
  };
}
