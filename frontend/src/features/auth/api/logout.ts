import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { meQueryOptions } from './get-me';

export async function logout(): Promise<void> {
  await apiClient.post<void>('/auth/logout');
}

/** Signs out; afterwards the cached user is `null`, so guarded loaders send people to sign-in. */
export function useLogout() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: logout,
    onSuccess: () => {
      apiClient.resetCsrfToken();
      queryClient.setQueryData(meQueryOptions().queryKey, null);
    },
  });
}
