import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListResponse, PollsterDto } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { pollsterKeys } from './keys';

export function listPollsters(signal?: AbortSignal): Promise<ListResponse<PollsterDto>> {
  return apiClient.get<ListResponse<PollsterDto>>('/pollsters', { signal });
}

export function pollstersQueryOptions() {
  return queryOptions({
    queryKey: pollsterKeys.list(),
    queryFn: ({ signal }) => listPollsters(signal),
  });
}

export function usePollsters() {
  return useQuery(pollstersQueryOptions());
}
