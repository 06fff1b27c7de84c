import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { env } from '../../../lib/env';
import { normalizeScorecardFilters, scorecardFiltersSchema, scorecardFiltersToSearch, type ScorecardFilters } from './filters';
import { scorecardKeys } from './keys';
import type { ScorecardsResponse } from './types';

export const getScorecardsInputSchema = z.object({
  auditId: z.number().int().positive(),
  filters: scorecardFiltersSchema,
});

function query(filters: ScorecardFilters): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of Object.entries(scorecardFiltersToSearch(filters))) if (value !== undefined) out[key] = value;
  return out;
}

export function getScorecards(auditId: number, filters: ScorecardFilters, signal?: AbortSignal): Promise<ScorecardsResponse> {
  const input = getScorecardsInputSchema.parse({ auditId, filters });
  return apiClient.get<ScorecardsResponse>(`/audits/${input.auditId}/scorecards`, { query: query(input.filters), signal });
}

export function scorecardsQueryOptions(auditId: number, filters: ScorecardFilters = {}) {
  const normalized = normalizeScorecardFilters(filters);
  return queryOptions({
    queryKey: scorecardKeys.list(auditId, normalized),
    queryFn: ({ signal }) => getScorecards(auditId, normalized, signal),
    // A filtered ranking is recomputed on the server (a bootstrap): keep the last table on screen meanwhile.
    placeholderData: keepPreviousData,
  });
}

export function useScorecards(auditId: number, filters: ScorecardFilters = {}) {
  return useQuery(scorecardsQueryOptions(auditId, filters));
}

/** The same scorecards as a CSV file, straight from the API (cells neutralised there). */
export function scorecardsCsvHref(auditId: number, filters: ScorecardFilters = {}): string {
  const params = new URLSearchParams({ ...query(filters), format: 'csv' });
  return `${env.apiBase}/audits/${auditId}/scorecards?${params.toString()}`;
}
