import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditDto } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { scorecardKeys } from './keys';

export const auditIdSchema = z.coerce.number().int().positive();

/** The audit a ranking belongs to: its settings, elections, data hash and whether it is out of date. */
export function getAudit(auditId: number, signal?: AbortSignal): Promise<AuditDto> {
  return apiClient.get<AuditDto>(`/audits/${auditIdSchema.parse(auditId)}`, { signal });
}

export function auditQueryOptions(auditId: number) {
  return queryOptions({
    queryKey: scorecardKeys.audit(auditId),
    queryFn: ({ signal }) => getAudit(auditId, signal),
  });
}

export function useAudit(auditId: number, options: { enabled?: boolean } = {}) {
  return useQuery({ ...auditQueryOptions(auditId), enabled: options.enabled ?? true });
}
