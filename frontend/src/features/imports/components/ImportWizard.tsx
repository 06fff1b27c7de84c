import type { ImportSummary } from '@veracast/shared-types';
import { useEffect, useId, useMemo, useRef, useState, type ChangeEvent } from 'react';
import { Link } from 'react-router-dom';
import { Alert, Button, Card, Input } from '../../../components/ui';
import { describeError, isApiError } from '../../../lib/api-client';
import { cn } from '../../../lib/cn';
import { paths } from '../../../lib/paths';
import { useSendImport, type SendImportInput, type UploadProgress } from '../api/send-import';
import {
  autoMatch,
  columnMapPayload,
  defaultOptionMap,
  detectLayout,
  distinctValues,
  knownColumns,
  mappingProblems,
  optionalColumns,
  optionColumns,
  requiredColumns,
  type ColumnMap,
  type ImportKind,
  type OptionChoice,
  type OptionMap,
  type PollLayout,
} from '../mapping';
import { FileProblem, formatBytes, readCsvFile, UPLOAD_LIMIT_MB, type ParsedFile } from '../parse-file';
import { CheckResult } from './CheckResult';
import { ColumnMapper } from './ColumnMapper';
import { CsvPreview } from './CsvPreview';
import { NewPollstersMapper } from './NewPollstersMapper';
import { OptionMapper } from './OptionMapper';
import { RowErrorsTable } from './RowErrorsTable';
import { UploadProgressBar } from './UploadProgressBar';

interface Outcome {
  summary: ImportSummary;
  /** The file and mapping the answer was for. */
  signature: string;
}

interface FileErrorDetails {
  errors?: { row: number; column: string; code: string; message: string }[];
}

export interface ImportWizardProps {
  /** Firms an unknown pollster name can be mapped to. */
  pollsters: { id: number; name: string }[];
  /** Options of the contests the file names, by contest key, for mapping wide-layout columns. */
  contestOptions?: Record<string, OptionChoice[]>;
  /** Called with the contest keys found in the file, so that the caller can load their options. */
  onContestKeysChange?: (keys: string[]) => void;
}

function Radio({ name, value, checked, onChange, label, hint }: { name: string; value: string; checked: boolean; onChange: () => void; label: string; hint: string }) {
  return (
    <label className={cn('flex cursor-pointer gap-3 rounded-md border px-4 py-3', checked ? 'border-accent-600 bg-accent-50' : 'border-ink-200 bg-white')}>
      <input type="radio" name={name} value={value} checked={checked} onChange={onChange} className="mt-1 size-4 accent-accent-700" />
      <span>
        <span className="block font-medium text-ink-900">{label}</span>
        <span className="block text-sm text-ink-600">{hint}</span>
      </span>
    </label>
  );
}

/**
 * Loads a results or polls CSV: the file is read in the browser with papaparse and previewed, its
 * columns are mapped to the ones Veracast expects (and, in the wide layout, option columns to
 * options), a dry run lists every row error, and only then is anything written.
 */
export function ImportWizard({ pollsters, contestOptions = {}, onContestKeysChange }: ImportWizardProps) {
  const fileInputId = useId();
  const [kind, setKind] = useState<ImportKind>('polls');
  const [file, setFile] = useState<File | null>(null);
  const [parsed, setParsed] = useState<ParsedFile | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [reading, setReading] = useState(false);
  const [columnMap, setColumnMap] = useState<ColumnMap>({});
  const [layout, setLayout] = useState<PollLayout>('long');
  const [optionOverrides, setOptionOverrides] = useState<OptionMap>({});
  const [pollsterMap, setPollsterMap] = useState<Record<string, string>>({});
  const [reason, setReason] = useState('');
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const abort = useRef<AbortController | null>(null);
  const send = useSendImport();

  const headers = useMemo(() => parsed?.headers ?? [], [parsed]);
  const contestKeys = useMemo(() => (parsed ? distinctValues(parsed.headers, parsed.rows, columnMap.contest_key) : []), [parsed, columnMap.contest_key]);
  const contestKeysText = contestKeys.join('\n');
  useEffect(() => {
    onContestKeysChange?.(contestKeysText ? contestKeysText.split('\n') : []);
  }, [contestKeysText, onContestKeysChange]);

  const known = useMemo(() => {
    const byKey = new Map<string, OptionChoice>();
    for (const key of contestKeys) for (const option of contestOptions[key] ?? []) if (!byKey.has(option.key)) byKey.set(option.key, option);
    return [...byKey.values()];
  }, [contestKeys, contestOptions]);

  const wide = kind === 'polls' && layout === 'wide';
  const wideColumns = useMemo(() => (wide ? optionColumns(headers, columnMap) : []), [wide, headers, columnMap]);
  const optionMap = useMemo(() => ({ ...defaultOptionMap(wideColumns, known), ...pick(optionOverrides, wideColumns) }), [wideColumns, known, optionOverrides]);
  const problems = parsed ? mappingProblems(kind, layout, columnMap, optionMap) : [];
  const effectiveLayout: PollLayout = kind === 'polls' ? layout : 'long';
  const signature = JSON.stringify([kind, file?.name, file?.size, file?.lastModified, effectiveLayout, columnMapPayload(columnMap, kind, effectiveLayout), wide ? optionMap : {}]);
  const stale = outcome !== null && outcome.signature !== signature;
  const committed = outcome?.summary.status === 'committed' ? outcome.summary : null;
  const latest = outcome && !stale ? outcome.summary : null;
  const hasRowErrors = (latest?.errors.length ?? 0) > 0;
  const busy = send.isPending;

  function resetAnswers() {
    setOutcome(null);
    setProgress(null);
    send.reset();
  }

  function mapFor(nextKind: ImportKind, nextParsed: ParsedFile) {
    const map = autoMatch(knownColumns(nextKind), nextParsed.headers);
    setColumnMap(map);
    setLayout(nextKind === 'polls' ? detectLayout(map) : 'long');
    setOptionOverrides({});
    setPollsterMap({});
  }

  function chooseKind(next: ImportKind) {
    setKind(next);
    resetAnswers();
    if (parsed) mapFor(next, parsed);
  }

  async function chooseFile(event: ChangeEvent<HTMLInputElement>) {
    const chosen = event.target.files?.[0] ?? null;
    resetAnswers();
    setFile(chosen);
    setParsed(null);
    setFileError(null);
    if (!chosen) return;
    setReading(true);
    try {
      const result = await readCsvFile(chosen);
      setParsed(result);
      mapFor(kind, result);
    } catch (error) {
      setFileError(error instanceof FileProblem ? error.message : describeError(error));
    } finally {
      setReading(false);
    }
  }

  function run(options: { dryRun: boolean; validOnly: boolean }) {
    if (!file || !parsed || problems.length) return;
    const numericPollsterMap = Object.fromEntries(
      Object.entries(pollsterMap)
        .filter(([, id]) => id !== '')
        .map(([name, id]) => [name, Number(id)]),
    );
    const input: SendImportInput = {
      kind,
      file,
      fileName: file.name,
      dryRun: options.dryRun,
      validOnly: options.validOnly,
      layout: kind === 'polls' ? layout : undefined,
      columnMap: columnMapPayload(columnMap, kind, effectiveLayout),
      optionMap: wide ? optionMap : undefined,
      pollsterMap: kind === 'polls' ? numericPollsterMap : undefined,
      reason: kind === 'results' && reason.trim() ? reason.trim() : undefined,
    };
    const controller = new AbortController();
    abort.current = controller;
    setProgress(null);
    send.mutate(
      { input, onProgress: setProgress, signal: controller.signal },
      { onSuccess: (summary) => setOutcome({ summary, signature }) },
    );
  }

  function startOver() {
    setFile(null);
    setParsed(null);
    setFileError(null);
    setColumnMap({});
    setReason('');
    resetAnswers();
  }

  if (committed) {
    const electionKeys = kind === 'results' && parsed ? distinctValues(parsed.headers, parsed.rows, columnMap.election_key, 20) : [];
    return <ImportDone summary={committed} kind={kind} contestKeys={contestKeys.slice(0, 20)} electionKeys={electionKeys} onAgain={startOver} />;
  }

  const fileError422 = send.error && isApiError(send.error) ? send.error : null;
  const fileLevelErrors = (fileError422?.details as FileErrorDetails | undefined)?.errors ?? [];

  return (
    <div className="space-y-6">
      <Card title="1. What does the file hold?">
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="sr-only">Kind of file</legend>
          <Radio name="kind" value="results" checked={kind === 'results'} onChange={() => chooseKind('results')} label="Results" hint="Votes per option per contest, with status and source." />
          <Radio name="kind" value="polls" checked={kind === 'polls'} onChange={() => chooseKind('polls')} label="Polls" hint="Published polls with their shares per option." />
        </fieldset>
      </Card>

      <Card title="2. Choose the file" description={`CSV with a header row, UTF-8, comma or semicolon delimited, up to ${UPLOAD_LIMIT_MB} MB.`}>
        <div className="space-y-3">
          <label htmlFor={fileInputId} className="block text-sm font-medium text-ink-800">
            CSV file
          </label>
          <input
            id={fileInputId}
            type="file"
            accept=".csv,text/csv"
            onChange={(event) => void chooseFile(event)}
            aria-invalid={fileError ? true : undefined}
            className="block text-sm file:mr-3 file:rounded-md file:border file:border-ink-300 file:bg-white file:px-3 file:py-1.5 file:font-medium"
          />
          {reading && <p role="status" className="text-sm text-ink-600">Reading the file…</p>}
          {fileError && <Alert tone="danger" title="The file cannot be used">{fileError}</Alert>}
          {file && parsed && (
            <p className="text-sm text-ink-700">
              {file.name}: {formatBytes(file.size)}, {parsed.rows.length.toLocaleString('en-GB')} data rows, {parsed.headers.length} columns,{' '}
              {parsed.delimiter === ';' ? 'semicolon' : 'comma'} delimited.
            </p>
          )}
          {parsed && parsed.warnings.length > 0 && (
            <Alert tone="caution" title="Papaparse noticed uneven rows">
              <ul className="list-disc pl-5">
                {parsed.warnings.map((w) => (
                  <li key={w}>{w}</li>
                ))}
              </ul>
            </Alert>
          )}
        </div>
      </Card>

      {parsed && file && (
        <>
          <Card title="3. Preview">
            <CsvPreview parsed={parsed} fileName={file.name} />
          </Card>

          <Card title="4. Map the columns" description="Each column Veracast expects, and the file column that holds it; matched by name where possible.">
            <div className="space-y-6">
              {kind === 'polls' && (
                <fieldset className="grid gap-3 sm:grid-cols-2">
                  <legend className="mb-2 text-sm font-semibold text-ink-900">Layout</legend>
                  <Radio
                    name="layout"
                    value="long"
                    checked={layout === 'long'}
                    onChange={() => setLayout('long')}
                    label="Long: one row per option per poll"
                    hint="The file has option_key and share columns."
                  />
                  <Radio
                    name="layout"
                    value="wide"
                    checked={layout === 'wide'}
                    onChange={() => setLayout('wide')}
                    label="Wide: one row per poll"
                    hint="Each option has its own column of shares."
                  />
                </fieldset>
              )}
              <ColumnMapper
                headers={headers}
                required={requiredColumns(kind, effectiveLayout)}
                optional={optionalColumns(kind)}
                value={columnMap}
                onChange={setColumnMap}
              />
              {wide && (
                <fieldset className="space-y-2">
                  <legend className="text-sm font-semibold text-ink-900">Option columns</legend>
                  <p className="text-sm text-ink-600">
                    Which option of the contest each remaining column holds. Options of the contests named in the file are
                    offered; undecided and other are reserved keys.
                  </p>
                  <OptionMapper columns={wideColumns} known={known} value={optionMap} onChange={setOptionOverrides} />
                </fieldset>
              )}
              {problems.length > 0 && (
                <Alert tone="caution" title="Finish the mapping">
                  <ul className="list-disc pl-5">
                    {problems.map((p) => (
                      <li key={p}>{p}</li>
                    ))}
                  </ul>
                </Alert>
              )}
            </div>
          </Card>

          <Card title="5. Check and import" description="The check is a dry run: the server validates every row and says what would change, and writes nothing.">
            <div className="space-y-5">
              {kind === 'results' && (
                <Input
                  label="Reason for changing certified results"
                  hint="Needed when the file changes a result that is already certified (reviewers only); kept in the change log."
                  value={reason}
                  onChange={(event) => setReason(event.target.value)}
                  fieldClassName="max-w-2xl"
                />
              )}
              {kind === 'polls' && latest && (latest.newPollsters?.length ?? 0) > 0 && (
                <NewPollstersMapper names={latest.newPollsters ?? []} pollsters={pollsters} value={pollsterMap} onChange={setPollsterMap} />
              )}

              <div className="flex flex-wrap items-center gap-3">
                <Button variant={latest ? 'secondary' : 'primary'} onClick={() => run({ dryRun: true, validOnly: false })} disabled={busy || problems.length > 0}>
                  Check (dry run)
                </Button>
                {!hasRowErrors && (
                  <Button variant={latest ? 'primary' : 'secondary'} onClick={() => run({ dryRun: false, validOnly: false })} disabled={busy || problems.length > 0}>
                    Import
                  </Button>
                )}
                {hasRowErrors && (
                  <Button variant="secondary" onClick={() => run({ dryRun: false, validOnly: true })} disabled={busy || problems.length > 0}>
                    Import valid rows only
                  </Button>
                )}
              </div>
              {hasRowErrors && (
                <p className="text-sm text-ink-700">
                  The whole file cannot be imported while it has errors. Choose a corrected file or fix the mapping and check
                  again, or import the valid rows only: the rows with errors are skipped and the choice is recorded on the import.
                </p>
              )}

              {busy && <UploadProgressBar progress={progress} onCancel={() => abort.current?.abort()} />}

              {send.isError && !(send.error instanceof DOMException && send.error.name === 'AbortError') && (
                <div className="space-y-3">
                  <Alert tone="danger" title={fileError422?.status === 413 ? 'The file is too large' : 'The file was refused'}>
                    {describeError(send.error)}
                  </Alert>
                  {fileLevelErrors.length > 0 && <RowErrorsTable errors={fileLevelErrors} caption="Problems with the file" />}
                </div>
              )}
              {send.isError && send.error instanceof DOMException && send.error.name === 'AbortError' && (
                <Alert tone="info">The upload was cancelled; nothing was written.</Alert>
              )}

              {outcome && <CheckResult summary={outcome.summary} kind={kind} stale={stale} />}
            </div>
          </Card>
        </>
      )}
    </div>
  );
}

function pick(map: OptionMap, columns: readonly string[]): OptionMap {
  const ids = new Set(columns.map((c) => c.trim().toLowerCase()));
  return Object.fromEntries(Object.entries(map).filter(([id]) => ids.has(id)));
}

interface ImportDoneProps {
  summary: ImportSummary;
  kind: ImportKind;
  contestKeys: string[];
  electionKeys: string[];
  onAgain: () => void;
}

function ImportDone({ summary, kind, contestKeys, electionKeys, onAgain }: ImportDoneProps) {
  const unit = kind === 'polls' ? 'polls' : 'result rows';
  return (
    <Card title="Import finished">
      <div className="space-y-4">
        <Alert tone="success" title={`Imported ${summary.rows.toLocaleString('en-GB')} data rows${summary.validOnly ? ' (valid rows only)' : ''}`}>
          {summary.created} {unit} created, {summary.updated} updated, {summary.unchanged} unchanged, {summary.skipped} skipped.
          {summary.newPollsters && summary.newPollsters.length > 0 && ` New firms: ${summary.newPollsters.join(', ')}.`}
        </Alert>
        {summary.errors.length > 0 && <RowErrorsTable errors={summary.errors} caption="Rows skipped for their errors" />}
        {electionKeys.length > 0 && (
          <div>
            <h3 className="text-sm font-semibold text-ink-900">Elections in the file</h3>
            <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
              {electionKeys.map((key) => (
                <li key={key}>
                  <Link to={paths.election.href(key)} className="text-accent-700 underline">
                    {key}
                  </Link>
                </li>
              ))}
            </ul>
          </div>
        )}
        {contestKeys.length > 0 && (
          <div>
            <h3 className="text-sm font-semibold text-ink-900">Contests in the file</h3>
            <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
              {contestKeys.map((key) => (
                <li key={key}>
                  <Link to={paths.contest.href(key)} className="text-accent-700 underline">
                    {key}
                  </Link>
                </li>
              ))}
            </ul>
          </div>
        )}
        <div className="flex flex-wrap gap-3">
          <Link to={paths.importRecord.href(summary.importId)} className="font-medium text-accent-700 underline">
            Open the import record
          </Link>
          <Button variant="secondary" onClick={onAgain}>
            Import another file
          </Button>
        </div>
      </div>
    </Card>
  );
}
