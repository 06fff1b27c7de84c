import { useMutation, useQueryClient } from '@tanstack/react-query';
import { electionInputSchema, type ElectionDto, type ElectionInput } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { electionKeys } from './keys';

export const createElectionInputSchema = electionInputSchema;

export function createElection(input: ElectionInput): Promise<ElectionDto> {
  return apiClient.post<ElectionDto>('/elections', createElectionInputSchema.parse(input));
}

export function useCreateElection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createElection,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: electionKeys.lists() }),
  });
}
