import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListResponse, QualityIssueDto } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { env } from '../../../lib/env';
import { qualityKeys } from './keys';

export const qualityFiltersSchema = z.object({ election: z.string().trim().max(100).optional() });
export type QualityFilters = z.infer<typeof qualityFiltersSchema>;

export function listQualityIssues(filters: QualityFilters, signal?: AbortSignal): Promise<ListResponse<QualityIssueDto>> {
  return apiClient.get<ListResponse<QualityIssueDto>>('/quality', { query: { election: filters.election || undefined }, signal });
}

export function qualityIssuesQueryOptions(filters: QualityFilters = {}) {
  const clean = qualityFiltersSchema.parse(filters);
  return queryOptions({
    queryKey: qualityKeys.list({ election: clean.election || undefined }),
    queryFn: ({ signal }) => listQualityIssues(clean, signal),
  });
}

export function useQualityIssues(filters: QualityFilters = {}) {
  return useQuery(qualityIssuesQueryOptions(filters));
}

/** The same checks as a CSV file (the server neutralises formula-like cells). */
export function qualityIssuesCsvUrl(filters: QualityFilters = {}): string {
  const params = new URLSearchParams({ format: 'csv' });
  if (filters.election) params.set('election', filters.election);
  return `${env.apiBase}/quality?${params.toString()}`;
}
