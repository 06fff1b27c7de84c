export { invitationKeys } from './api/keys';
export {
  getInvitationPreview,
  invitationPreviewQueryOptions,
  useInvitationPreview,
} from './api/get-invitation-preview';
export { acceptInvitation, acceptInvitationInputSchema, useAcceptInvitation } from './api/accept-invitation';
export { createInvitation, createInvitationInputSchema, useCreateInvitation } from './api/create-invitation';
export { invitationsQueryOptions, isPendingInvitation, listInvitations, useInvitations } from './api/list-invitations';
export { AcceptInvitationForm } from './components/AcceptInvitationForm';
export { InviteForm } from './components/InviteForm';
export { PendingInvitationsTable } from './components/PendingInvitationsTable';
