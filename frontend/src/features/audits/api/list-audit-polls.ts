import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditPollDto, ListResponse } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { env } from '../../../lib/env';
import { auditKeys } from './keys';

export const auditPollFiltersSchema = z.object({
  election: z.string().max(100).optional(),
  pollster: z.number().int().positive().optional(),
  inWindow: z.boolean().optional(),
  isFinal: z.boolean().optional(),
  used: z.boolean().optional(),
});
export type AuditPollFilters = z.infer<typeof auditPollFiltersSchema>;

/** Every poll of the audit's elections with its metrics (up to ~100k rows). */
export function listAuditPolls(id: number, filters: AuditPollFilters = {}, signal?: AbortSignal) {
  return apiClient.get<ListResponse<AuditPollDto>>(`/audits/${id}/polls`, {
    query: auditPollFiltersSchema.parse(filters),
    signal,
  });
}

/** The same rows as CSV, straight from the server (cells neutralised there). */
export function auditPollsCsvUrl(id: number, filters: AuditPollFilters = {}): string {
  const params = new URLSearchParams({ format: 'csv' });
  for (const [key, value] of Object.entries(auditPollFiltersSchema.parse(filters))) {
    if (value !== undefined) params.set(key, String(value));
  }
  return `${env.apiBase}/audits/${id}/polls?${params.toString()}`;
}

export function auditPollsQueryOptions(id: number, filters: AuditPollFilters = {}) {
  return queryOptions({
    queryKey: auditKeys.polls(id, filters),
    queryFn: ({ signal }) => listAuditPolls(id, filters, signal),
    // An audit is frozen: its rows never change.
    staleTime: Infinity,
  });
}

export function useAuditPolls(id: number, filters: AuditPollFilters = {}) {
  return useQuery(auditPollsQueryOptions(id, filters));
}
