import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationPreview } from '@veracast/shared-types';
import { apiClient, isApiError } from '../../../lib/api-client';
import { invitationKeys } from './keys';

/** Public: what an invitation is for. 404 when unknown, 410 when used or expired. */
export function getInvitationPreview(token: string, signal?: AbortSignal): Promise<InvitationPreview> {
  return apiClient.get<InvitationPreview>(`/invitations/${encodeURIComponent(token)}`, { signal });
}

export function invitationPreviewQueryOptions(token: string) {
  return queryOptions({
    queryKey: invitationKeys.preview(token),
    queryFn: ({ signal }) => getInvitationPreview(token, signal),
    retry: (failureCount, error) => !(isApiError(error) && error.status < 500) && failureCount < 2,
    staleTime: 5 * 60_000,
  });
}

export function useInvitationPreview(token: string) {
  return useQuery(invitationPreviewQueryOptions(token));
}
