import { queryOptions, useQuery } from '@tanstack/react-query';
import { keySchema, type ContestDto, type ElectionDto, type QualityIssueDto } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { electionKeys } from './keys';

/** An election's page data: the election, its contests and the data-quality checks run on it. */
export type ElectionDetail = ElectionDto & { contests: ContestDto[]; quality: QualityIssueDto[] };

export const electionKeyParamSchema = keySchema;

export function getElection(key: string, signal?: AbortSignal): Promise<ElectionDetail> {
  return apiClient.get<ElectionDetail>(`/elections/${encodeURIComponent(key)}`, { signal });
}

export function electionQueryOptions(key: string) {
  return queryOptions({
    queryKey: electionKeys.detail(key),
    queryFn: ({ signal }) => getElection(key, signal),
  });
}

export function useElection(key: string) {
  return useQuery(electionQueryOptions(key));
}
