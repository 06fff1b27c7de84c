import type { Invitation } from '@veracast/shared-types';
import { useMemo } from 'react';
import { Alert, DataTable, LoadingState, createDataTableColumnHelper } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { formatDateTime } from '../../../utils/format';
import { ROLE_LABELS } from '../../../utils/roles';
import { isPendingInvitation, useInvitations } from '../api/list-invitations';

const column = createDataTableColumnHelper<Invitation>();
const columns = column.columns([
  column.accessor('email', { header: 'E-mail address' }),
  column.accessor((row) => ROLE_LABELS[row.role], { id: 'role', header: 'Role' }),
  column.accessor((row) => row.invitedBy ?? '—', { id: 'invitedBy', header: 'Invited by' }),
  column.accessor('createdAt', { header: 'Sent', sortFn: 'datetime', cell: (info) => formatDateTime(info.getValue()) }),
  column.accessor('expiresAt', {
    header: 'Expires',
    sortFn: 'datetime',
    cell: (info) => formatDateTime(info.getValue()),
  }),
]);

export function PendingInvitationsTable() {
  const invitations = useInvitations();
  const pending = useMemo(
    () => (invitations.data ? invitations.data.items.filter((item) => isPendingInvitation(item)) : []),
    [invitations.data],
  );

  if (invitations.isPending) return <LoadingState label="Loading invitations…" />;
  if (invitations.isError) return <Alert tone="danger">{describeError(invitations.error)}</Alert>;

  return (
    <DataTable
      caption="Pending invitations"
      columns={columns}
      data={pending}
      getRowId={(row) => String(row.id)}
      initialSorting={[{ id: 'createdAt', desc: true }]}
      emptyMessage="No invitation is waiting to be accepted."
    />
  );
}
