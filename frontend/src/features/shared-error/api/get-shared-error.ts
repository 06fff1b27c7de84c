import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import type { SharedErrorAnalysisDto } from '../types';
import { auditIdSchema } from './get-audit';
import { sharedErrorKeys } from './keys';

/** An election key from a route parameter. */
export const electionKeySchema = z.string().trim().min(1).max(100);

export const sharedErrorInputSchema = z.object({ auditId: auditIdSchema, electionKey: electionKeySchema });
export type SharedErrorInput = z.infer<typeof sharedErrorInputSchema>;

export function getSharedError(input: SharedErrorInput, signal?: AbortSignal): Promise<SharedErrorAnalysisDto> {
  const { auditId, electionKey } = sharedErrorInputSchema.parse(input);
  return apiClient.get<SharedErrorAnalysisDto>(`/audits/${auditId}/shared-error`, { query: { election: electionKey }, signal });
}

export function sharedErrorQueryOptions(input: SharedErrorInput) {
  return queryOptions({
    queryKey: sharedErrorKeys.analysis(input.auditId, input.electionKey),
    queryFn: ({ signal }) => getSharedError(input, signal),
    // An audit is frozen: its analysis never changes.
    staleTime: Infinity,
  });
}

export function useSharedError(input: SharedErrorInput) {
  return useQuery(sharedErrorQueryOptions(input));
}
