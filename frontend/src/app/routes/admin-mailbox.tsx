import { Link, useParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui';
import { MailboxTable, MailMessageView, mailMessageIdSchema } from '../../features/mailbox';
import { paths } from '../../lib/paths';
import { NotFoundRoute } from './not-found';

export function AdminMailboxRoute() {
  return (
    <>
      <PageHeader
        title="Local mailbox"
        description="E-mail that Veracast sent while no real mail server is configured. Open a message to follow its links, such as an invitation."
      />
      <MailboxTable />
    </>
  );
}

export function AdminMailMessageRoute() {
  const parsed = mailMessageIdSchema.safeParse(useParams().messageId);
  if (!parsed.success) return <NotFoundRoute />;
  return (
    <>
      <p className="mb-4 text-sm">
        <Link to={paths.adminMailbox.href()} className="font-medium text-accent-700 underline">
          <span aria-hidden="true">← </span>All messages
        </Link>
      </p>
      <PageHeader title="Message" />
      <MailMessageView id={parsed.data} />
    </>
  );
}
