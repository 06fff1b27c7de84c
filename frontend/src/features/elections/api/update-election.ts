import { useMutation, useQueryClient } from '@tanstack/react-query';
import { electionInputSchema, type ElectionDto } from '@veracast/shared-types';
import type { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { electionKeys } from './keys';

/** Every field but the key, each optional: the body of `PATCH /elections/:key`. */
export const updateElectionInputSchema = electionInputSchema.partial().omit({ key: true });
export type UpdateElectionInput = z.infer<typeof updateElectionInputSchema>;

export function updateElection({ key, changes }: { key: string; changes: UpdateElectionInput }): Promise<ElectionDto> {
  return apiClient.patch<ElectionDto>(`/elections/${encodeURIComponent(key)}`, updateElectionInputSchema.parse(changes));
}

export function useUpdateElection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateElection,
    onSuccess: async (_data, { key }) => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: electionKeys.detail(key) }),
        queryClient.invalidateQueries({ queryKey: electionKeys.lists() }),
      ]);
    },
  });
}
