export { qualityKeys } from './api/keys';
export {
  listQualityIssues,
  qualityFiltersSchema,
  qualityIssuesCsvUrl,
  qualityIssuesQueryOptions,
  useQualityIssues,
  type QualityFilters,
} from './api/list-quality-issues';
export { QUALITY_CHECKS, checkLabel, countByCheck, type QualityCheck } from './checks';
export { QualityIssues } from './components/QualityIssues';
