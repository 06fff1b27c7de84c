import { queryOptions, useQuery } from '@tanstack/react-query';
import { UNDECIDED_TREATMENTS, type AuditPollDto, type ListResponse, type PollDto, type UndecidedTreatment } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { contestKeys } from './keys';

/** A poll of the contest with its live metrics (null when they cannot be computed). */
export type ContestPoll = PollDto & { metrics: AuditPollDto | null };

export const undecidedTreatmentSchema = z.enum(UNDECIDED_TREATMENTS).catch('raw');

export function listContestPolls(key: string, undecided: UndecidedTreatment, signal?: AbortSignal): Promise<ListResponse<ContestPoll>> {
  return apiClient.get<ListResponse<ContestPoll>>(`/contests/${encodeURIComponent(key)}/polls`, { query: { undecided }, signal });
}

export function contestPollsQueryOptions(key: string, undecided: UndecidedTreatment = 'raw') {
  return queryOptions({
    queryKey: contestKeys.polls(key, undecided),
    queryFn: ({ signal }) => listContestPolls(key, undecided, signal),
  });
}

export function useContestPolls(key: string, undecided: UndecidedTreatment = 'raw') {
  return useQuery(contestPollsQueryOptions(key, undecided));
}
