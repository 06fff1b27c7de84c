import { Alert, LoadingState } from '../../../components/ui';
import { describeError, isApiError } from '../../../lib/api-client';
import { formatDateTime } from '../../../utils/format';
import { linkify } from '../../../utils/linkify';
import { useMailMessage } from '../api/get-mail-message';

/** A plain-text body whose http(s) addresses are links, so an invitation link can be opened. */
export function MailBody({ text }: { text: string }) {
  return (
    <div className="font-mono text-sm leading-relaxed break-words whitespace-pre-wrap text-ink-900">
      {linkify(text).map((segment, index) =>
        segment.kind === 'link' ? (
          <a key={index} href={segment.href} className="text-accent-700 underline hover:text-accent-900">
            {segment.text}
          </a>
        ) : (
          <span key={index}>{segment.text}</span>
        ),
      )}
    </div>
  );
}

export function MailMessageView({ id }: { id: number }) {
  const message = useMailMessage(id);

  if (message.isPending) return <LoadingState label="Loading the message…" />;
  if (message.isError) {
    return (
      <Alert tone="danger">
        {isApiError(message.error) && message.error.status === 404
          ? 'There is no such message in the local mailbox.'
          : describeError(message.error)}
      </Alert>
    );
  }

  const mail = message.data;
  return (
    <article aria-labelledby="mail-subject" className="rounded-lg border border-ink-200 bg-white shadow-sm">
      <header className="border-b border-ink-200 px-5 py-4">
        <h2 id="mail-subject" className="text-lg font-semibold text-ink-950">
          {mail.subject || '(no subject)'}
        </h2>
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 text-sm">
          <dt className="text-ink-500">From</dt>
          <dd className="text-ink-800">{mail.from}</dd>
          <dt className="text-ink-500">To</dt>
          <dd className="text-ink-800">{mail.to}</dd>
          <dt className="text-ink-500">Received</dt>
          <dd className="text-ink-800">{formatDateTime(mail.receivedAt)}</dd>
        </dl>
      </header>
      <div className="px-5 py-4">
        <MailBody text={mail.text} />
      </div>
    </article>
  );
}
