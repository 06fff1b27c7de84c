/**
 * Statistics core for pollster scorecards and fair rankings (METHODS §6–7,
 * SPEC §5 and §7). Pure functions: plain data in, plain data out; every
 * degenerate input throws a `MetricInputError` naming the parameter.
 */
export type { ExcessPoll, Interval, PollsterId } from './types';
export { averageRanks } from './ranks';
export { percentileInterval, percentileInvertedCdf, percentileLinear } from './percentiles';
export {
  contestAdjustedExcess,
  type ContestAdjustedExcess,
  type FirmExcess,
  type PollExcess,
} from './excess';
export {
  betweenFirmVariance,
  derSimonianLaird,
  empiricalBayesShrink,
  pooledWithinVariance,
  shrinkFirmMeans,
  type DerSimonianLairdResult,
  type FirmShrinkage,
  type FirmSummary,
  type ShrinkResult,
} from './shrinkage';
export { clusteredMean, type ClusteredMean } from './clustered';
export {
  bootstrapRanks,
  bootstrapWithinFirm,
  DEFAULT_DRAWS,
  type BootstrapRanksOptions,
  type BootstrapRanksResult,
  type FirmRankBootstrap,
  type FirmWithinBootstrap,
  type WithinFirmBootstrapResult,
  type WithinFirmGroup,
} from './bootstrap';
export {
  computeScorecards,
  type ScorecardField,
  type ScorecardItem,
  type ScorecardPoll,
  type Scorecards,
  type ScorecardSettings,
} from './scorecards';
export {
  breakdowns,
  tInterval,
  DAYS_OUT_BINS,
  SAMPLE_SIZE_BINS,
  samplingFunnel,
  UNDECIDED_BINS,
  type Breakdown,
  type BreakdownBin,
  type BreakdownPoll,
  type BreakdownSpec,
  type FunnelPoint,
  type NumericBin,
} from './breakdowns';
