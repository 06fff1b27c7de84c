import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListResponse } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { scorecardKeys } from './keys';
import type { AuditListItem } from './types';

/** Every audit, newest first (the API's order). */
export function listAudits(signal?: AbortSignal): Promise<ListResponse<AuditListItem>> {
  return apiClient.get<ListResponse<AuditListItem>>('/audits', { signal });
}

export function auditListQueryOptions() {
  return queryOptions({
    queryKey: scorecardKeys.auditList(),
    queryFn: ({ signal }) => listAudits(signal),
  });
}

export function useAuditList() {
  return useQuery(auditListQueryOptions());
}
