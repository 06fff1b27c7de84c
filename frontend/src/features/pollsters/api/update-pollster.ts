import { useMutation, useQueryClient } from '@tanstack/react-query';
import { pollsterInputSchema, type PollsterDto } from '@veracast/shared-types';
import type { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

export const updatePollsterInputSchema = pollsterInputSchema.partial();
export type UpdatePollsterInput = z.input<typeof updatePollsterInputSchema>;

/** Renames a firm, replaces its aliases or its notes. */
export function updatePollster({ id, changes }: { id: number; changes: UpdatePollsterInput }): Promise<PollsterDto> {
  return apiClient.patch<PollsterDto>(`/pollsters/${id}`, updatePollsterInputSchema.parse(changes));
}

export function useUpdatePollster() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePollster,
    // The firm's name shows on every poll of it, in other features' screens too.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
