import type { ImportSummary } from '@veracast/shared-types';
import { Alert, Stat, StatGroup } from '../../../components/ui';
import { importErrorsCsvUrl } from '../api/list-imports';
import { RowErrorsTable } from './RowErrorsTable';

/** Rows with at least one error (a row may break several rules). */
export function badRowCount(summary: Pick<ImportSummary, 'errors'>): number {
  return new Set(summary.errors.filter((e) => e.row > 0).map((e) => e.row)).size;
}

export interface CheckResultProps {
  summary: ImportSummary;
  kind: 'results' | 'polls';
  /** The mapping or file changed since this answer. */
  stale?: boolean;
}

/** What a dry run (or a refused import) found: counts, and every row error with its rule. */
export function CheckResult({ summary, kind, stale = false }: CheckResultProps) {
  const unit = kind === 'polls' ? 'polls' : 'result rows';
  const errors = summary.errors.length;
  const dry = summary.status === 'dry_run';
  return (
    <div className="space-y-4">
      {stale && (
        <Alert tone="caution" title="The file or the mapping changed since this check">
          Run the check again to see what the import would do now.
        </Alert>
      )}
      {summary.status === 'failed' ? (
        <Alert tone="danger" title={`${errors} row error${errors === 1 ? '' : 's'} in ${badRowCount(summary)} row${badRowCount(summary) === 1 ? '' : 's'}: nothing was written`}>
          A file with errors imports nothing unless you choose to import its valid rows only. Fix the file or the mapping and
          check again, or import the valid rows only.
        </Alert>
      ) : dry && errors > 0 ? (
        <Alert tone="caution" title={`Dry run with the valid rows only: ${errors} row error${errors === 1 ? '' : 's'}`}>
          Nothing was written. The rows with errors would be skipped.
        </Alert>
      ) : dry ? (
        <Alert tone="success" title="Dry run: the file is valid">
          Nothing was written yet. Import it to save what is listed below.
        </Alert>
      ) : null}
      <StatGroup columns={4}>
        <Stat label="Data rows" value={summary.rows.toLocaleString('en-GB')} />
        <Stat label={dry ? `New ${unit}` : `Created ${unit}`} value={summary.created.toLocaleString('en-GB')} hint={summary.status === 'failed' ? 'nothing while errors remain' : undefined} />
        <Stat label={dry ? 'Would change' : 'Updated'} value={summary.updated.toLocaleString('en-GB')} hint={`${summary.unchanged.toLocaleString('en-GB')} unchanged`} />
        <Stat label="Skipped" value={summary.skipped.toLocaleString('en-GB')} hint="because of row errors" />
      </StatGroup>
      {errors > 0 && (
        <div className="space-y-2">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h3 className="text-sm font-semibold text-ink-900">Row errors</h3>
            <a href={importErrorsCsvUrl(summary.importId)} download className="text-sm font-medium text-accent-700 underline">
              Download the row errors (CSV)
            </a>
          </div>
          <RowErrorsTable errors={summary.errors} caption="Row errors found by the check" />
        </div>
      )}
    </div>
  );
}
