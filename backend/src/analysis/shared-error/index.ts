/**
 * Shared-error analysis: the statistics behind `GET /api/v1/audits/:id/shared-error`
 * (SPEC §5, §7; METHODS §5–6). Pure functions: plain data in, plain data out.
 *
 * Every function except `computeSharedError` throws `MetricInputError` (../errors) naming the
 * offending parameter on degenerate input; `computeSharedError` turns those into nulls and
 * plain-English warnings.
 */
export { clusteredMean, type ClusteredMeanResult } from './clustered-mean';
export { icc1, type Icc1Result } from './icc';
export { derSimonianLaird, type DerSimonianLairdResult } from './dersimonian-laird';
export {
  contestBiasAndHouseEffects,
  varianceDecomposition,
  type FirmContestError,
  type ContestBias,
  type HouseEffect,
  type ContestBiasAndHouseEffects,
  type VarianceComponents,
  type VarianceDecomposition,
} from './house-effects';
export {
  effectivePolls,
  pollAverageInterval,
  errorStructureFromIcc,
  contestAverageSummary,
  type EffectivePollsResult,
  type PollAverageInterval,
  type ErrorStructure,
  type PollErrorAndVariance,
  type ContestAverageSummary,
} from './effective-polls';
export { pearson, spearman, type PearsonResult, type SpearmanResult } from './correlation';
export {
  pairwiseFirmCorrelations,
  type PairwiseOptions,
  type FirmPairCorrelation,
} from './pairwise';
export {
  shapiroWilk,
  jarqueBera,
  andersonDarling,
  qqPoints,
  NORMALITY_MIN_N,
  SHAPIRO_MAX_N,
  type ShapiroWilkResult,
  type JarqueBeraResult,
  type AndersonDarlingResult,
  type QqPoint,
} from './normality';
export {
  historicalAverageInterval,
  tooCloseToCall,
  type HistoricalAverageInterval,
} from './historical';
export {
  computeSharedError,
  type SharedErrorPoll,
  type SharedErrorInput,
  type SharedErrorAnalysis,
  type ContestDetail,
} from './compute';
