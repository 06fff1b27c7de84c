import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditSettings, ListResponse } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { sharedErrorKeys } from './keys';

/** One row of `GET /audits`. */
export interface AuditListItem {
  id: number;
  name: string;
  settings: AuditSettings;
  dataHash: string;
  coreVersion: string;
  pollCount: number;
  createdAt: string;
  createdBy: string | null;
  rerunOf: number | null;
}

export function listAudits(signal?: AbortSignal): Promise<ListResponse<AuditListItem>> {
  return apiClient.get<ListResponse<AuditListItem>>('/audits', { signal });
}

export function auditListQueryOptions() {
  return queryOptions({ queryKey: sharedErrorKeys.auditList(), queryFn: ({ signal }) => listAudits(signal) });
}

export function useAuditList() {
  return useQuery(auditListQueryOptions());
}
