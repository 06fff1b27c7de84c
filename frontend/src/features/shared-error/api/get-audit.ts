import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditDto } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { sharedErrorKeys } from './keys';

/** An audit id from a route parameter or a query string: a positive integer. */
export const auditIdSchema = z.coerce.number().int().positive();

export function getAudit(auditId: number, signal?: AbortSignal): Promise<AuditDto> {
  return apiClient.get<AuditDto>(`/audits/${auditIdSchema.parse(auditId)}`, { signal });
}

export function auditQueryOptions(auditId: number) {
  return queryOptions({ queryKey: sharedErrorKeys.auditDetail(auditId), queryFn: ({ signal }) => getAudit(auditId, signal) });
}

export function useAudit(auditId: number | null) {
  return useQuery({ ...auditQueryOptions(auditId ?? 0), enabled: auditId !== null });
}
