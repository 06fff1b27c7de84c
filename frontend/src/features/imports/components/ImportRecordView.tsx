import { Alert, LoadingState, Stat, StatGroup } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { formatDateTime } from '../../../utils/format';
import { useImportRecord } from '../api/get-import';
import { importErrorsCsvUrl } from '../api/list-imports';
import { IMPORT_STATUS_LABELS } from './ImportsTable';
import { RowErrorsTable } from './RowErrorsTable';

/** One import: who ran it and when, its outcome, its counts and every row error. */
export function ImportRecordView({ id }: { id: number }) {
  const record = useImportRecord(id);
  if (record.isPending) return <LoadingState label="Loading the import…" />;
  if (record.isError) return <Alert tone="danger">{describeError(record.error)}</Alert>;
  const r = record.data;
  return (
    <div className="space-y-5">
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[max-content_1fr]">
        <dt className="font-medium text-ink-700">File</dt>
        <dd className="break-all">{r.fileName}</dd>
        <dt className="font-medium text-ink-700">Kind</dt>
        <dd>{r.kind === 'polls' ? 'Polls' : 'Results'}</dd>
        <dt className="font-medium text-ink-700">Run by</dt>
        <dd>{r.user ?? 'Unknown'}</dd>
        <dt className="font-medium text-ink-700">When</dt>
        <dd>{formatDateTime(r.createdAt)}</dd>
        <dt className="font-medium text-ink-700">Outcome</dt>
        <dd>
          {IMPORT_STATUS_LABELS[r.status]}
          {r.validOnly ? ' — the user chose to import the valid rows only' : ''}
        </dd>
        <dt className="font-medium text-ink-700">File hash (SHA-256)</dt>
        <dd className="font-mono text-xs break-all">{r.fileHash}</dd>
      </dl>
      <StatGroup columns={4}>
        <Stat label="Data rows" value={r.rows} />
        <Stat label="Created" value={r.created} />
        <Stat label="Updated" value={r.updated} hint={`${r.unchanged} unchanged`} />
        <Stat label="Skipped" value={r.skipped} />
      </StatGroup>
      <div className="space-y-2">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 className="text-base font-semibold text-ink-900">Row errors ({r.errorCount})</h2>
          {r.errorCount > 0 && (
            <a href={importErrorsCsvUrl(r.id)} download className="text-sm font-medium text-accent-700 underline">
              Download the row errors (CSV)
            </a>
          )}
        </div>
        <RowErrorsTable errors={r.errors} caption={`Row errors of import ${r.id}`} />
      </div>
    </div>
  );
}
