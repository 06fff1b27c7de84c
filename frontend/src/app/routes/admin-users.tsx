import { useQueryClient } from '@tanstack/react-query';
import type { User } from '@veracast/shared-types';
import { Link } from 'react-router-dom';
import { Card, PageHeader } from '../../components/ui';
import { meQueryOptions, useCurrentUser } from '../../features/auth';
import { InviteForm, PendingInvitationsTable } from '../../features/invitations';
import { UsersTable } from '../../features/users';
import { paths } from '../../lib/paths';

export function AdminUsersRoute() {
  const { data: me } = useCurrentUser();
  const queryClient = useQueryClient();

  function onUserUpdated(user: User) {
    if (me && user.id === me.id) queryClient.setQueryData(meQueryOptions().queryKey, user);
  }

  return (
    <div className="space-y-6">
      <PageHeader
        title="Users & invitations"
        description="Invite people, set their roles, and disable accounts that should no longer sign in."
      />
      <Card
        title="Invite someone"
        description={
          <>
            The invitation e-mail holds a link that works once. Without a mail server it lands in the{' '}
            <Link to={paths.adminMailbox.href()} className="font-medium text-accent-700 underline">
              local mailbox
            </Link>
            .
          </>
        }
      >
        <InviteForm />
      </Card>
      <Card title="Pending invitations">
        <PendingInvitationsTable />
      </Card>
      <Card title="Users">
        <UsersTable currentUserId={me?.id ?? null} onUserUpdated={onUserUpdated} />
      </Card>
    </div>
  );
}
