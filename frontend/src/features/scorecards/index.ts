export { auditIdSchema, auditQueryOptions, getAudit, useAudit } from './api/get-audit';
export { getPollster, pollsterIdSchema, pollsterProfileQueryOptions, usePollsterProfile } from './api/get-pollster';
export { getScorecards, scorecardsCsvHref, scorecardsQueryOptions, useScorecards } from './api/get-scorecards';
export { auditListQueryOptions, listAudits, useAuditList } from './api/list-audits';
export { auditPollsQueryOptions, listAuditPolls, useAuditPolls } from './api/list-audit-polls';
export {
  hasScorecardFilters,
  normalizeScorecardFilters,
  scorecardFiltersFromSearch,
  scorecardFiltersSchema,
  scorecardFiltersToSearch,
  type ScorecardFilters,
} from './api/filters';
export { scorecardKeys } from './api/keys';
export type { AuditListItem, Interval, PollsterProfile, ScorecardField, ScorecardItem, ScorecardsResponse } from './api/types';
export { AuditRankings, type AuditRankingsProps } from './components/AuditRankings';
export { FirmAccuracyPanel, type FirmAccuracyPanelProps, type FirmChartsData } from './components/FirmAccuracyPanel';
export { IntervalBar, intervalBarX, sharedDomain, type IntervalBarProps } from './components/IntervalBar';
export { RankingCaution } from './components/RankingCaution';
export { RankingFilters, type RankingFiltersProps } from './components/RankingFilters';
export { RankingTable, RANKING_COLUMN_NOTES, type RankingTableProps } from './components/RankingTable';
