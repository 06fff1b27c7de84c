import type { QueryClient } from '@tanstack/react-query';
import { useQueryClient } from '@tanstack/react-query';
import type { User } from '@veracast/shared-types';
import { useState } from 'react';
import { useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Alert } from '../../components/ui';
import { meQueryOptions, SignOutButton } from '../../features/auth';
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
  const [otherSession, setOtherSession] = useState<{ created: User; signedIn: User } | null>(null);

  async function afterAccept(created: User) {
    // Accepting may or may not open a session for the new account; ask the server which.
    const current = await queryClient.fetchQuery({ ...meQueryOptions(), staleTime: 0 }).catch(() => null);
    if (current?.id === created.id) {
      await navigate(paths.home.href(), { replace: true });
    } else if (current) {
      setOtherSession({ created, signedIn: current });
    } else {
      await navigate(paths.signIn.href({ notice: 'account-ready' }), { replace: true });
    }
  }

  if (otherSession) {
    return (
      <PublicPanel title="Join Veracast">
        <Alert tone="success" title="The account is ready">
          {otherSession.created.email} can now sign in. This browser is still signed in as{' '}
          {otherSession.signedIn.email}; sign out first to use the new account.
        </Alert>
        <div className="mt-4">
          <SignOutButton
            onSignedOut={() => void navigate(paths.signIn.href({ notice: 'account-ready' }), { replace: true })}
          />
        </div>
      </PublicPanel>
    );
  }

  return (
    <PublicPanel title="Join Veracast">
      <AcceptInvitationForm token={token} onAccepted={(user) => void afterAccept(user)} />
    </PublicPanel>
  );
}
