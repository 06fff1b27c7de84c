import { useMutation, useQueryClient } from '@tanstack/react-query';
import { pollInputSchema, type PollDto, type PollInput } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';

export const savePollInputSchema = pollInputSchema;

/** Creates a poll (`mode: 'create'`) or replaces an existing one with the same key. */
export function savePoll({ mode, poll }: { mode: 'create' | 'update'; poll: PollInput }): Promise<PollDto> {
  const body = savePollInputSchema.parse(poll);
  return mode === 'create'
    ? apiClient.post<PollDto>('/polls', body)
    : apiClient.put<PollDto>(`/polls/${encodeURIComponent(body.key)}`, body);
}

export function useSavePoll() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: savePoll,
    // A poll shows on its contest, its firm, its election and the quality checks.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
