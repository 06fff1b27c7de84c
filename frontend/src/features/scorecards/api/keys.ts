import type { ScorecardFilters } from './filters';

/** Query keys of the scorecards feature, namespaced so that no other feature's cache entry collides. */
export const scorecardKeys = {
  all: ['scorecards'] as const,
  lists: () => [...scorecardKeys.all, 'list'] as const,
  list: (auditId: number, filters: ScorecardFilters) => [...scorecardKeys.lists(), { auditId, ...filters }] as const,
  audits: () => [...scorecardKeys.all, 'audits'] as const,
  auditList: () => [...scorecardKeys.audits(), 'list', {}] as const,
  audit: (auditId: number) => [...scorecardKeys.audits(), 'detail', auditId] as const,
  polls: (auditId: number, filter: { pollster?: number; used?: boolean }) =>
    [...scorecardKeys.all, 'polls', 'list', { auditId, ...filter }] as const,
  pollster: (pollsterId: number) => [...scorecardKeys.all, 'pollsters', 'detail', pollsterId] as const,
};
