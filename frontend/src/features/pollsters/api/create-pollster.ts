import { useMutation, useQueryClient } from '@tanstack/react-query';
import { pollsterInputSchema, type PollsterDto } from '@veracast/shared-types';
import type { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { pollsterKeys } from './keys';

export const createPollsterInputSchema = pollsterInputSchema;
export type CreatePollsterInput = z.input<typeof createPollsterInputSchema>;

export function createPollster(input: CreatePollsterInput): Promise<PollsterDto> {
  return apiClient.post<PollsterDto>('/pollsters', createPollsterInputSchema.parse(input));
}

export function useCreatePollster() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createPollster,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: pollsterKeys.lists() }),
  });
}
