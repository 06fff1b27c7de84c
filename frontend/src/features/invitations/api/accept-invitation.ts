import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationAcceptSchema, type InvitationAccept, type MeResponse, type User } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { invitationKeys } from './keys';

export const acceptInvitationInputSchema = invitationAcceptSchema;
export type AcceptInvitationInput = InvitationAccept;

export async function acceptInvitation(input: AcceptInvitationInput): Promise<User> {
  const { user } = await apiClient.post<MeResponse>('/invitations/accept', acceptInvitationInputSchema.parse(input));
  return user;
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: (_user, input) => {
      // The session may have changed, and the invitation is now used.
      apiClient.resetCsrfToken();
      void queryClient.invalidateQueries({ queryKey: invitationKeys.preview(input.token) });
    },
  });
}
