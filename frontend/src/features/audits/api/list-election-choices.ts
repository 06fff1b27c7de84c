import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ElectionDto } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { auditKeys } from './keys';

/** The elections an audit can cover, newest first. */
export async function listElectionChoices(signal?: AbortSignal): Promise<ElectionDto[]> {
  const { items } = await apiClient.get<{ items: ElectionDto[] }>('/elections', { signal });
  return [...items].sort((a, b) => (a.date < b.date ? 1 : a.date > b.date ? -1 : a.key.localeCompare(b.key)));
}

export function electionChoicesQueryOptions() {
  return queryOptions({
    queryKey: auditKeys.electionChoices(),
    queryFn: ({ signal }) => listElectionChoices(signal),
  });
}

export function useElectionChoices() {
  return useQuery(electionChoicesQueryOptions());
}
