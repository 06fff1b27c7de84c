import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { breakdownKeys } from './keys';
import type { AuditBreakdownsResponse } from './types';

export const breakdownsInputSchema = z.object({ auditId: z.number().int().positive() });

/** "Where did the error come from": an audit's error broken down by days out, population, mode, … */
export function getBreakdowns(auditId: number, signal?: AbortSignal): Promise<AuditBreakdownsResponse> {
  const input = breakdownsInputSchema.parse({ auditId });
  return apiClient.get<AuditBreakdownsResponse>(`/audits/${input.auditId}/breakdowns`, { signal });
}

export function breakdownsQueryOptions(auditId: number) {
  return queryOptions({
    queryKey: breakdownKeys.detail(auditId),
    queryFn: ({ signal }) => getBreakdowns(auditId, signal),
  });
}

export function useBreakdowns(auditId: number) {
  return useQuery(breakdownsQueryOptions(auditId));
}
