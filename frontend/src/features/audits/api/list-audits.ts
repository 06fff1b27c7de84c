import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditDto, ListResponse } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { auditKeys } from './keys';

/** One audit in the list: the frozen record without its headline or elections. */
export type AuditSummary = Pick<
  AuditDto,
  'id' | 'name' | 'settings' | 'dataHash' | 'coreVersion' | 'pollCount' | 'createdAt' | 'createdBy' | 'rerunOf'
>;

export function listAudits(signal?: AbortSignal): Promise<ListResponse<AuditSummary>> {
  return apiClient.get<ListResponse<AuditSummary>>('/audits', { signal });
}

export function auditsQueryOptions() {
  return queryOptions({
    queryKey: auditKeys.list(),
    queryFn: ({ signal }) => listAudits(signal),
  });
}

export function useAudits() {
  return useQuery(auditsQueryOptions());
}
