export { pollKeys } from './api/keys';
export { getPoll, pollKeySchema, pollQueryOptions, usePoll, type PollDetail, type PollTreatmentMetrics } from './api/get-poll';
export { ContestResultFacts, PollFacts, PollSharesTable } from './components/PollFacts';
export { PollView, type PollViewProps } from './components/PollView';
export { PollMetricsTable, type PollMetricsTableProps } from './components/PollMetricsTable';
