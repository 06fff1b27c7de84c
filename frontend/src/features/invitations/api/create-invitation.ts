import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationCreateSchema, type Invitation, type InvitationCreate } from '@veracast/shared-types';
import { apiClient } from '../../../lib/api-client';
import { invitationsQueryOptions } from './list-invitations';

export const createInvitationInputSchema = invitationCreateSchema;
export type CreateInvitationInput = InvitationCreate;

export function createInvitation(input: CreateInvitationInput): Promise<Invitation> {
  return apiClient.post<Invitation>('/invitations', createInvitationInputSchema.parse(input));
}

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsQueryOptions().queryKey }),
  });
}
