import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditSettings, ListResponse } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { noteKeys } from './keys';

/** What the block inserter needs of an audit. */
export interface AuditChoice {
  id: number;
  name: string;
  settings: AuditSettings;
  dataHash: string;
  createdAt: string;
}

export function listAuditChoices(signal?: AbortSignal) {
  return apiClient.get<ListResponse<AuditChoice>>('/audits', { signal });
}

export function auditChoicesQueryOptions() {
  return queryOptions({ queryKey: noteKeys.auditChoices(), queryFn: ({ signal }) => listAuditChoices(signal), staleTime: 60_000 });
}

export const useAuditChoices = () => useQuery(auditChoicesQueryOptions());
