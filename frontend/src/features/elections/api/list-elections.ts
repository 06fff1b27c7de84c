import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ElectionDto, ListResponse } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { electionKeys } from './keys';

export function listElections(signal?: AbortSignal): Promise<ListResponse<ElectionDto>> {
  return apiClient.get<ListResponse<ElectionDto>>('/elections', { signal });
}

export function electionsQueryOptions() {
  return queryOptions({
    queryKey: electionKeys.list(),
    queryFn: ({ signal }) => listElections(signal),
  });
}

export function useElections() {
  return useQuery(electionsQueryOptions());
}
