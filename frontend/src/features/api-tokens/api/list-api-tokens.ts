import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiToken, ListResponse } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { apiTokenKeys } from './keys';

export function listApiTokens(signal?: AbortSignal): Promise<ListResponse<ApiToken>> {
  return apiClient.get<ListResponse<ApiToken>>('/api-tokens', { signal });
}

export function apiTokensQueryOptions() {
  return queryOptions({
    queryKey: apiTokenKeys.list(),
    queryFn: ({ signal }) => listApiTokens(signal),
  });
}

export function useApiTokens() {
  return useQuery(apiTokensQueryOptions());
}
