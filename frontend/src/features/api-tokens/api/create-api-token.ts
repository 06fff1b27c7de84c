import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiTokenCreateSchema, type ApiTokenCreated } from '@veracast/shared-types';
import type { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { apiTokensQueryOptions } from './list-api-tokens';

export const createApiTokenInputSchema = apiTokenCreateSchema;
export type CreateApiTokenInput = z.infer<typeof createApiTokenInputSchema>;

/** Creates a token; the answer holds the secret, which the server never shows again. */
export function createApiToken(input: CreateApiTokenInput): Promise<ApiTokenCreated> {
  return apiClient.post<ApiTokenCreated>('/api-tokens', createApiTokenInputSchema.parse(input));
}

export function useCreateApiToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createApiToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: apiTokensQueryOptions().queryKey }),
  });
}
