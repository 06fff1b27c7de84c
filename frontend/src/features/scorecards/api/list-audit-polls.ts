import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditPollDto, ListResponse } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { scorecardKeys } from './keys';

export const auditPollsInputSchema = z.object({
  auditId: z.number().int().positive(),
  /** Only this firm's polls. */
  pollster: z.number().int().positive().optional(),
  /** Only the polls the scorecards use (in the window, final when the audit says so, computable). */
  used: z.boolean().optional(),
});
export type AuditPollsInput = z.infer<typeof auditPollsInputSchema>;

export function listAuditPolls(input: AuditPollsInput, signal?: AbortSignal): Promise<ListResponse<AuditPollDto>> {
  const { auditId, pollster, used } = auditPollsInputSchema.parse(input);
  return apiClient.get<ListResponse<AuditPollDto>>(`/audits/${auditId}/polls`, { query: { pollster, used }, signal });
}

export function auditPollsQueryOptions(input: AuditPollsInput) {
  const { auditId, ...filter } = input;
  return queryOptions({
    queryKey: scorecardKeys.polls(auditId, filter),
    queryFn: ({ signal }) => listAuditPolls(input, signal),
  });
}

export function useAuditPolls(input: AuditPollsInput, options: { enabled?: boolean } = {}) {
  return useQuery({ ...auditPollsQueryOptions(input), enabled: options.enabled ?? true });
}
