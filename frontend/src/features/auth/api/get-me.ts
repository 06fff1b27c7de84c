import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MeResponse, User } from '@veracast/shared-types';
import { apiClient, isApiError } from '../../../lib/api-client';
import { authKeys } from './keys';

/** The signed-in user, or `null` when nobody is signed in (the server answers 401). */
export async function getMe(signal?: AbortSignal): Promise<User | null> {
  try {
    const { user } = await apiClient.get<MeResponse>('/auth/me', { signal });
    return user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export function meQueryOptions() {
  return queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });
}

/** The signed-in user (`null` when signed out, `undefined` while the first answer is pending). */
export function useCurrentUser() {
  return useQuery(meQueryOptions());
}
