import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { apiTokensQueryOptions } from './list-api-tokens';

export async function revokeApiToken(id: number): Promise<void> {
  await apiClient.delete<void>(`/api-tokens/${id}`);
}

export function useRevokeApiToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeApiToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: apiTokensQueryOptions().queryKey }),
  });
}
