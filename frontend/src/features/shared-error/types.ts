/**
 * Wire shapes of the shared-error and history endpoints, as the backend answers them
 * (`GET /api/v1/audits/:id/shared-error`, `GET /api/v1/audits/:id/history`). Any number may be
 * null when the data are too thin; `warnings` says why. Points unless stated.
 */

export interface VarianceParts {
  shared: number;
  house: number;
  noise: number;
}

export interface ContestBiasDto {
  contestKey: string;
  k: number;
  bias: number;
}

export interface HouseEffectDto {
  firm: string;
  polls: number;
  contests: number;
  plain: number;
  leaveOneOut: number | null;
  leaveOneOutPolls: number;
}

export interface ContestDetailDto {
  contestKey: string;
  k: number;
  meanError: number;
  certifiedMargin: number | null;
  averageMargin: number | null;
  naiveSe: number | null;
  adjustedSe: number | null;
  nEff: number | null;
  tau2: number | null;
  q: number | null;
  qP: number | null;
  i2: number | null;
  naiveCovered: boolean | null;
  adjustedCovered: boolean | null;
}

export interface FirmPairDto {
  a: string;
  b: string;
  n: number;
  pearson: number | null;
  pearsonP: number | null;
  spearman: number | null;
  spearmanP: number | null;
  nAdjusted: number;
  pearsonAdjusted: number | null;
  pearsonAdjustedP: number | null;
  insufficient: boolean;
  note: string | null;
}

export interface QqPointDto {
  theoretical: number;
  sample: number;
  value: number;
}

export interface SharedErrorAnalysisDto {
  electionKey: string;
  excludedNotOriented: number;
  polls: number;
  contests: number;
  firms: number;
  meanSignedError: number | null;
  clusteredSe: number | null;
  df: number | null;
  t: number | null;
  p: number | null;
  ciLow: number | null;
  ciHigh: number | null;
  icc: number | null;
  iccF: number | null;
  iccP: number | null;
  iccDf: [number, number] | null;
  errorStructure: { sharedVariance: number; withinVariance: number } | null;
  shapiroW: number | null;
  shapiroP: number | null;
  jarqueBera: number | null;
  jarqueBeraP: number | null;
  andersonDarling: number | null;
  andersonDarlingP: number | null;
  varianceSplit: VarianceParts | null;
  varianceComponents: VarianceParts | null;
  contestBias: ContestBiasDto[];
  houseEffects: HouseEffectDto[];
  contestsDetail: ContestDetailDto[];
  pairs: FirmPairDto[];
  qq: QqPointDto[];
  warnings: string[];
}

export interface HistoryElectionDto {
  electionKey: string;
  name: string;
  date: string;
  polls: number;
  meanSignedError: number | null;
  lo: number | null;
  hi: number | null;
}

export interface HistoricalIntervalDto {
  n: number;
  meanMiss: number;
  rmse: number;
  rmseHalfWidth: number;
  empiricalHalfWidth: number;
  halfWidth: number;
  fewContests: boolean;
}

export interface HistoryContestDto {
  contestKey: string;
  electionKey: string;
  k: number;
  averageMargin: number;
  certifiedMargin: number;
  miss: number;
  naiveHalfWidth: number;
  tooClose: boolean | null;
  calledRight: boolean;
}

export interface AuditHistoryDto {
  elections: HistoryElectionDto[];
  averageInterval: HistoricalIntervalDto | null;
  naiveHalfWidth: number | null;
  method: string;
  contests: HistoryContestDto[];
  tooCloseCount: number;
  tooCloseCalledRight: number;
}

/** One election of an audit with the blocs that orient its signed errors. */
export interface AuditElection {
  key: string;
  name: string;
  date: string;
  blocA: string | null;
  blocB: string | null;
  fictional: boolean;
}
