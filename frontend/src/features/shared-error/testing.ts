/** Builders of wire-shaped test data for this feature's tests. */
import type { AuditPollDto } from '@veracast/shared-types';
import type { SharedErrorAnalysisDto } from './types';

/** An analysis with nothing computable, as the backend answers for an election without polls. */
export function buildEmptyAnalysis(overrides: Partial<SharedErrorAnalysisDto> = {}): SharedErrorAnalysisDto {
  return {
    electionKey: 'demo-2022-general',
    excludedNotOriented: 0,
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
    warnings: ['There are no polls with a usable signed error, so nothing could be computed.'],
    ...overrides,
  };
}

/**
 * A small election with a clear shared miss: three contests, three firms, every firm below zero.
 * The figures are made up for the screen, not computed; tests check how they are shown.
 */
export function buildSharedMissAnalysis(overrides: Partial<SharedErrorAnalysisDto> = {}): SharedErrorAnalysisDto {
  return buildEmptyAnalysis({
    polls: 6,
    contests: 3,
    firms: 3,
    meanSignedError: -4.25,
    clusteredSe: 0.5,
    df: 2,
    t: -8.5,
    p: 0.0136,
    ciLow: -6.4,
    ciHigh: -2.1,
    icc: 0.6,
    iccF: 5.5,
    iccP: 0.09,
    iccDf: [2, 3],
    errorStructure: { sharedVariance: 3, withinVariance: 2 },
    shapiroW: 0.93,
    shapiroP: 0.58,
    jarqueBera: 0.4,
    jarqueBeraP: 0.82,
    andersonDarling: 0.25,
    andersonDarlingP: 0.61,
    varianceSplit: { shared: 0.6, house: 0.3, noise: 0.1 },
    varianceComponents: { shared: 3, house: 1.5, noise: 0.5 },
    contestBias: [
      { contestKey: 'demo-2022-general-north', k: 2, bias: -5 },
      { contestKey: 'demo-2022-general-south', k: 3, bias: -4 },
      { contestKey: 'demo-2022-general-east', k: 1, bias: -3 },
    ],
    houseEffects: [
      { firm: 'Alder Polling', polls: 2, contests: 2, plain: 0.5, leaveOneOut: 0.6, leaveOneOutPolls: 2 },
      { firm: 'Birch Surveys', polls: 2, contests: 2, plain: -0.4, leaveOneOut: -0.5, leaveOneOutPolls: 2 },
      { firm: '=Cedar Research', polls: 2, contests: 2, plain: 1.2, leaveOneOut: 1.3, leaveOneOutPolls: 1 },
    ],
    contestsDetail: [
      {
        contestKey: 'demo-2022-general-north', k: 2, meanError: -5, certifiedMargin: 6, averageMargin: 1, naiveSe: 1.5, adjustedSe: 2.2, nEff: 1.25,
        tau2: 0.3, q: 1.2, qP: 0.27, i2: 0.17, naiveCovered: false, adjustedCovered: false,
      },
      {
        contestKey: 'demo-2022-general-south', k: 3, meanError: -4, certifiedMargin: 2, averageMargin: -2, naiveSe: 1.2, adjustedSe: 2, nEff: 1.36,
        tau2: 0, q: 0.5, qP: 0.78, i2: 0, naiveCovered: false, adjustedCovered: true,
      },
      {
        contestKey: 'demo-2022-general-east', k: 1, meanError: -3, certifiedMargin: 10, averageMargin: 7, naiveSe: 2, adjustedSe: 2.2, nEff: 1,
        tau2: null, q: null, qP: null, i2: null, naiveCovered: true, adjustedCovered: true,
      },
    ],
    pairs: [
      { a: 'Alder Polling', b: 'Birch Surveys', n: 2, pearson: null, pearsonP: null, spearman: null, spearmanP: null, nAdjusted: 2, pearsonAdjusted: null, pearsonAdjustedP: null, insufficient: true, note: 'only 2 common contests; at least 5 are needed' },
      { a: 'Alder Polling', b: '=Cedar Research', n: 6, pearson: 0.71, pearsonP: 0.11, spearman: 0.6, spearmanP: 0.2, nAdjusted: 6, pearsonAdjusted: -0.35, pearsonAdjustedP: 0.5, insufficient: false, note: null },
    ],
    qq: [
      { theoretical: -1.2, sample: -1.1, value: -6 },
      { theoretical: -0.6, sample: -0.7, value: -5.2 },
      { theoretical: 0, sample: 0.1, value: -4.1 },
      { theoretical: 0.6, sample: 0.5, value: -3.5 },
      { theoretical: 1.2, sample: 1.2, value: -2.2 },
    ],
    warnings: ['1 contest has a single poll, so excess variance (τ², Q, I²) is not computed for it: demo-2022-general-east.'],
    ...overrides,
  });
}

export function buildAuditPoll(overrides: Partial<AuditPollDto> = {}): AuditPollDto {
  return {
    pollKey: 'p1', contestKey: 'demo-2022-general-north', electionKey: 'demo-2022-general', pollsterId: 1, pollster: 'Alder Polling',
    refA: 'a', refB: 'b', refBasis: 'blocs', marginError: -5, absMarginError: 5, lean: 'B', mosteller3: null, mosteller5: null, mtkA: null,
    mtkSe: null, mtkP: null, aeB: null, aeBw: null, winnerCalled: true, shareCovered: true, marginCovered: false, daysOut: 3, daysOutEnd: 3,
    undecidedShare: 5, twoPartyShareError: null, inWindow: true, isFinal: true, fieldworkEnd: '2022-05-10', sampleSize: 1000, population: 'lv',
    mode: 'online', sponsorType: null, disclosure: 1, nEff: 1000, pollA: 45, pollB: 44, resultA: 48, resultB: 42, notes: [], error: null,
    ...overrides,
  };
}
