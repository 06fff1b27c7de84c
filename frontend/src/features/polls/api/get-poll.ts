import { queryOptions, useQuery } from '@tanstack/react-query';
import { keySchema, type ContestDto, type PollDto, type UndecidedTreatment } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { pollKeys } from './keys';

/**
 * One poll's metrics under one undecided treatment, with the inputs they came from. Fields the
 * server does not send are absent; a metric the data cannot define is null with a reason in notes.
 */
export interface PollTreatmentMetrics {
  refA?: string | null;
  refB?: string | null;
  refBasis?: 'blocs' | 'top_two' | null;
  winner?: string | null;
  runnerUp?: string | null;
  pollA?: number | null;
  pollB?: number | null;
  resultA?: number | null;
  resultB?: number | null;
  nEff?: number | null;
  nEffBasis?: 'stated_moe' | 'design_effect' | null;
  nDesign?: number | null;
  marginError?: number | null;
  absMarginError?: number | null;
  lean?: 'A' | 'B' | 'none' | null;
  twoPartyShareError?: number | null;
  mosteller3?: number | null;
  mosteller3Set?: string[] | null;
  mosteller5?: number | null;
  mtkA?: number | null;
  mtkSe?: number | null;
  mtkZ?: number | null;
  mtkP?: number | null;
  mtkLower?: number | null;
  mtkUpper?: number | null;
  aeB?: number | null;
  aeBw?: number | null;
  aeChi2?: number | null;
  aeChi2P?: number | null;
  aeG2?: number | null;
  aeG2P?: number | null;
  aeDf?: number | null;
  winnerCalled?: boolean | null;
  shareCovered?: boolean | null;
  shareInterval?: [number, number] | null;
  marginCovered?: boolean | null;
  marginInterval?: [number, number] | null;
  daysOut?: number | null;
  daysOutEnd?: number | null;
  undecidedShare?: number | null;
  notes?: string[];
  error?: string | null;
}

export type PollDetail = PollDto & {
  contest: ContestDto;
  metrics: Partial<Record<UndecidedTreatment, PollTreatmentMetrics | null>>;
};

export const pollKeySchema = keySchema;

export function getPoll(pollKey: string, signal?: AbortSignal): Promise<PollDetail> {
  return apiClient.get<PollDetail>(`/polls/${encodeURIComponent(pollKeySchema.parse(pollKey))}`, { signal });
}

export function pollQueryOptions(pollKey: string) {
  return queryOptions({
    queryKey: pollKeys.detail(pollKey),
    queryFn: ({ signal }) => getPoll(pollKey, signal),
  });
}

export function usePoll(pollKey: string) {
  return useQuery(pollQueryOptions(pollKey));
}
