import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListResponse, User } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { userKeys } from './keys';

export function listUsers(signal?: AbortSignal): Promise<ListResponse<User>> {
  return apiClient.get<ListResponse<User>>('/users', { signal });
}

export function usersQueryOptions() {
  return queryOptions({
    queryKey: userKeys.list(),
    queryFn: ({ signal }) => listUsers(signal),
  });
}

export function useUsers() {
  return useQuery(usersQueryOptions());
}
