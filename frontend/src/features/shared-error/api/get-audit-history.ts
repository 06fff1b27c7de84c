import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { AuditHistoryDto } from '../types';
import { auditIdSchema } from './get-audit';
import { sharedErrorKeys } from './keys';

export function getAuditHistory(auditId: number, signal?: AbortSignal): Promise<AuditHistoryDto> {
  return apiClient.get<AuditHistoryDto>(`/audits/${auditIdSchema.parse(auditId)}/history`, { signal });
}

export function auditHistoryQueryOptions(auditId: number) {
  return queryOptions({
    queryKey: sharedErrorKeys.history(auditId),
    queryFn: ({ signal }) => getAuditHistory(auditId, signal),
    staleTime: Infinity,
  });
}

export function useAuditHistory(auditId: number) {
  return useQuery(auditHistoryQueryOptions(auditId));
}
