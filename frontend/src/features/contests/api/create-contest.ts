import { useMutation, useQueryClient } from '@tanstack/react-query';
import { contestInputSchema, type ContestDto, type ContestInput } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';

export const createContestInputSchema = contestInputSchema;

export function createContest(input: ContestInput): Promise<ContestDto> {
  return apiClient.post<ContestDto>('/contests', createContestInputSchema.parse(input));
}

export function useCreateContest() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createContest,
    // The election's page lists its contests; it belongs to another feature, so refresh broadly.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
