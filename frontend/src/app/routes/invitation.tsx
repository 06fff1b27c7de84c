import type { QueryClient } from '@tanstack/react-query';
import { useQueryClient } from '@tanstack/react-query';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { meQueryOptions } from '../../features/auth';
import { AcceptInvitationForm, invitationPreviewQueryOptions } from '../../features/invitations';
import { paths } from '../../lib/paths';
import { PublicPanel } from '../layout/PublicLayout';

export function invitationLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    if (params.token) await queryClient.prefetchQuery(invitationPreviewQueryOptions(params.token));
    return null;
  };
}

export function InvitationRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();

  async function afterAccept() {
    // Accepting may or may not open a session; ask the server which.
    const user = await queryClient.fetchQuery({ ...meQueryOptions(), staleTime: 0 }).catch(() => null);
    await navigate(user ? paths.home.href() : paths.signIn.href({ notice: 'account-ready' }), { replace: true });
  }

  return (
    <PublicPanel title="Join Veracast">
      <AcceptInvitationForm token={token} onAccepted={() => void afterAccept()} />
    </PublicPanel>
  );
}
