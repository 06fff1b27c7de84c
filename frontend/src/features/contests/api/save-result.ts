import { useMutation, useQueryClient } from '@tanstack/react-query';
import { resultInputSchema, type ContestDto, type ResultInput } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';

export const saveResultInputSchema = resultInputSchema;

/**
 * Enters or changes a contest's result. The server refuses (403) certifying without the reviewer
 * role and (400) changing a certified result without a reason.
 */
export function saveResult({ contestKey, result }: { contestKey: string; result: ResultInput }): Promise<ContestDto> {
  return apiClient.put<ContestDto>(`/contests/${encodeURIComponent(contestKey)}/result`, saveResultInputSchema.parse(result));
}

export function useSaveResult() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveResult,
    // Results move every metric, election count and quality check.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
