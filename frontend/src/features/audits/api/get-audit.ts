import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditDto } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { auditKeys } from './keys';

/** An audit id as it appears in a URL. */
export const auditIdSchema = z.coerce.number().int().positive();

export function getAudit(id: number, signal?: AbortSignal): Promise<AuditDto> {
  return apiClient.get<AuditDto>(`/audits/${auditIdSchema.parse(id)}`, { signal });
}

export function auditQueryOptions(id: number) {
  return queryOptions({
    queryKey: auditKeys.detail(id),
    queryFn: ({ signal }) => getAudit(id, signal),
  });
}

export function useAudit(id: number) {
  return useQuery(auditQueryOptions(id));
}
