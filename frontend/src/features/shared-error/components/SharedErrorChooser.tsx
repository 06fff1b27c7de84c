import { Link } from 'react-router-dom';
import { Alert, Card, FictionalDataLabel, LoadingState, Select } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { formatDate, formatDateTime } from '../../../utils/format';
import { useAudit } from '../api/get-audit';
import { useAuditList } from '../api/list-audits';

const linkClass = 'font-medium text-accent-700 underline hover:text-accent-900';

export interface SharedErrorChooserProps {
  /** The audit chosen in the URL; the newest audit when null. */
  auditId: number | null;
  onAuditChange: (auditId: number) => void;
}

/** Picks an audit, then offers each of its elections' shared-error analysis and the across-elections view. */
export function SharedErrorChooser({ auditId, onAuditChange }: SharedErrorChooserProps) {
  const audits = useAuditList();
  const items = audits.data?.items ?? [];
  const chosen = auditId !== null && items.some((a) => a.id === auditId) ? auditId : (items[0]?.id ?? null);
  const audit = useAudit(chosen);

  if (audits.isPending) return <LoadingState label="Loading audits…" />;
  if (audits.isError) return <Alert tone="danger">{describeError(audits.error)}</Alert>;
  if (items.length === 0) {
    return (
      <Alert tone="info" title="No audit yet">
        The shared-error analysis is part of an audit. An analyst creates one on the <Link to={paths.audits.href()}>Audits</Link> page.
      </Alert>
    );
  }

  return (
    <div className="space-y-6">
      <Card title="1. Choose an audit" description="An audit is a frozen computation: its analyses never change, so the numbers you cite stay put.">
        <Select
          label="Audit"
          value={chosen ?? ''}
          onChange={(event) => onAuditChange(Number(event.target.value))}
          fieldClassName="max-w-xl"
          hint={auditId !== null && chosen !== auditId ? 'The audit in the address was not found; the newest is shown.' : undefined}
        >
          {items.map((a) => (
            <option key={a.id} value={a.id}>
              {`${a.name} (#${a.id}, ${formatDateTime(a.createdAt)}, ${a.pollCount} polls)`}
            </option>
          ))}
        </Select>
      </Card>

      <Card title="2. Choose an election" description="Each election gets its own analysis; the history compares them.">
        {audit.isPending ? (
          <LoadingState label="Loading the audit…" />
        ) : audit.isError ? (
          <Alert tone="danger">{describeError(audit.error)}</Alert>
        ) : (
          <div className="space-y-4">
            {audit.data.fictional && <FictionalDataLabel />}
            {audit.data.outOfDate && (
              <Alert tone="caution" title="This audit is out of date">
                The data changed after it was computed. Its numbers are still those it published; a new audit would use the current data.
              </Alert>
            )}
            <ul className="divide-y divide-ink-100 rounded-md border border-ink-200">
              {[...audit.data.elections]
                .sort((a, b) => (a.date < b.date ? 1 : -1))
                .map((e) => (
                  <li key={e.key} className="flex flex-wrap items-center justify-between gap-3 px-4 py-3">
                    <div>
                      <p className="font-medium text-ink-900">{e.name}</p>
                      <p className="text-sm text-ink-600">
                        {formatDate(e.date)}
                        {e.blocA && e.blocB ? ` · errors signed as ${e.blocA} − ${e.blocB}` : ' · no bloc pair to sign errors'}
                        {e.fictional ? ' · fictional' : ''}
                      </p>
                    </div>
                    <Link to={paths.auditSharedError.href(audit.data.id, e.key)} className={linkClass}>
                      Shared error<span className="sr-only"> in {e.name}</span>
                    </Link>
                  </li>
                ))}
            </ul>
            <p>
              <Link to={paths.auditHistory.href(audit.data.id)} className={linkClass}>
                Across elections: the shared miss of each and how wide a poll average’s interval should be
              </Link>
            </p>
          </div>
        )}
      </Card>
    </div>
  );
}
