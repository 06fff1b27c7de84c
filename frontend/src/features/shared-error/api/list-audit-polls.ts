import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditPollDto, ListResponse } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { sharedErrorInputSchema, type SharedErrorInput } from './get-shared-error';
import { sharedErrorKeys } from './keys';

/** The polls of one election that the audit's analyses use (`?used=true`). */
export function listUsedAuditPolls(input: SharedErrorInput, signal?: AbortSignal): Promise<ListResponse<AuditPollDto>> {
  const { auditId, electionKey } = sharedErrorInputSchema.parse(input);
  return apiClient.get<ListResponse<AuditPollDto>>(`/audits/${auditId}/polls`, { query: { election: electionKey, used: true }, signal });
}

export function usedAuditPollsQueryOptions(input: SharedErrorInput) {
  return queryOptions({
    queryKey: sharedErrorKeys.polls(input.auditId, input.electionKey),
    queryFn: ({ signal }) => listUsedAuditPolls(input, signal),
    staleTime: Infinity,
  });
}

export function useUsedAuditPolls(input: SharedErrorInput) {
  return useQuery(usedAuditPollsQueryOptions(input));
}
