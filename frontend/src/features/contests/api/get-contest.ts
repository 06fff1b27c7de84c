import { queryOptions, useQuery } from '@tanstack/react-query';
import { keySchema, type ChangeLogEntryDto, type ContestDto } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { contestKeys } from './keys';

/** A contest with the change log of its result and whether a source document is attached. */
export type ContestDetail = ContestDto & { history: ChangeLogEntryDto[]; hasSourceDocument: boolean };

export const contestKeyParamSchema = keySchema;

export function getContest(key: string, signal?: AbortSignal): Promise<ContestDetail> {
  return apiClient.get<ContestDetail>(`/contests/${encodeURIComponent(key)}`, { signal });
}

export function contestQueryOptions(key: string) {
  return queryOptions({
    queryKey: contestKeys.detail(key),
    queryFn: ({ signal }) => getContest(key, signal),
  });
}

export function useContest(key: string) {
  return useQuery(contestQueryOptions(key));
}
