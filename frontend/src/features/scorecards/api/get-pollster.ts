import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { scorecardKeys } from './keys';
import type { PollsterProfile } from './types';

export const pollsterIdSchema = z.coerce.number().int().positive();

/** A firm with its aliases, sponsors and disclosure completeness. */
export function getPollster(pollsterId: number, signal?: AbortSignal): Promise<PollsterProfile> {
  return apiClient.get<PollsterProfile>(`/pollsters/${pollsterIdSchema.parse(pollsterId)}`, { signal });
}

export function pollsterProfileQueryOptions(pollsterId: number) {
  return queryOptions({
    queryKey: scorecardKeys.pollster(pollsterId),
    queryFn: ({ signal }) => getPollster(pollsterId, signal),
  });
}

export function usePollsterProfile(pollsterId: number, options: { enabled?: boolean } = {}) {
  return useQuery({ ...pollsterProfileQueryOptions(pollsterId), enabled: options.enabled ?? true });
}
