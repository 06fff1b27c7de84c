import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Invitation, ListResponse } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { invitationKeys } from './keys';

export function listInvitations(signal?: AbortSignal): Promise<ListResponse<Invitation>> {
  return apiClient.get<ListResponse<Invitation>>('/invitations', { signal });
}

export function invitationsQueryOptions() {
  return queryOptions({
    queryKey: invitationKeys.list(),
    queryFn: ({ signal }) => listInvitations(signal),
  });
}

export function useInvitations() {
  return useQuery(invitationsQueryOptions());
}

/** Not yet accepted and not yet expired at `now`. */
export function isPendingInvitation(invitation: Invitation, now: number = Date.now()): boolean {
  return invitation.acceptedAt === null && Date.parse(invitation.expiresAt) > now;
}
