import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DisclosureItem, PollDto, PollsterDto } from '@veracast/shared-types';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { pollsterKeys } from './keys';

/** A firm with its polls and, per disclosure item, the fraction of its polls that carry it. */
export type PollsterDetail = PollsterDto & { polls: PollDto[]; disclosureItems: Partial<Record<DisclosureItem, number>> };

export const pollsterIdSchema = z.coerce.number().int().positive();

export function getPollster(id: number, signal?: AbortSignal): Promise<PollsterDetail> {
  return apiClient.get<PollsterDetail>(`/pollsters/${id}`, { signal });
}

export function pollsterQueryOptions(id: number) {
  return queryOptions({
    queryKey: pollsterKeys.detail(id),
    queryFn: ({ signal }) => getPollster(id, signal),
  });
}

export function usePollster(id: number) {
  return useQuery(pollsterQueryOptions(id));
}
