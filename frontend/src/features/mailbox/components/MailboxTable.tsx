import type { MailMessage } from '@veracast/shared-types';
import { Link } from 'react-router-dom';
import { Alert, Button, DataTable, LoadingState, createDataTableColumnHelper } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { formatDateTime } from '../../../utils/format';
import { useMailMessages } from '../api/list-mail-messages';

const column = createDataTableColumnHelper<MailMessage>();
const columns = column.columns([
  column.accessor('to', { header: 'To' }),
  column.accessor('subject', {
    header: 'Subject',
    cell: (info) => (
      <Link
        to={paths.adminMailMessage.href(info.row.original.id)}
        className="font-medium text-accent-700 underline hover:text-accent-900"
      >
        {info.getValue() || '(no subject)'}
      </Link>
    ),
  }),
  column.accessor('receivedAt', {
    header: 'Received',
    sortFn: 'datetime',
    cell: (info) => formatDateTime(info.getValue()),
  }),
]);

export function MailboxTable() {
  const messages = useMailMessages();

  if (messages.isPending) return <LoadingState label="Loading messages…" />;
  if (messages.isError) return <Alert tone="danger">{describeError(messages.error)}</Alert>;

  return (
    <div className="space-y-3">
      <div className="flex justify-end">
        <Button variant="secondary" size="sm" busy={messages.isFetching} busyText="Refreshing…" onClick={() => void messages.refetch()}>
          Refresh
        </Button>
      </div>
      <DataTable
        caption="Messages in the local mailbox"
        columns={columns}
        data={messages.data.items}
        getRowId={(row) => String(row.id)}
        searchLabel="Search messages"
        initialSorting={[{ id: 'receivedAt', desc: true }]}
        emptyMessage="No message has been sent yet."
      />
    </div>
  );
}
