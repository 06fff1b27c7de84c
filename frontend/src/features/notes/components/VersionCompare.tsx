import { useMemo } from 'react';
import { Alert, LoadingState, Select } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { cn } from '../../../lib/cn';
import { formatDateTime } from '../../../utils/format';
import { useNoteVersion, useNoteVersions } from '../api/versions';
import { diffLines, diffStats } from '../utils/line-diff';

const ROW_STYLE = { same: '', removed: 'bg-danger-50', added: 'bg-accent-50' } as const;

/** Two versions of a note side by side, line by line; changed lines are marked in words and colour. */
export function VersionCompare({ noteId, a, b, onChange }: { noteId: number; a: number | null; b: number | null; onChange: (a: number, b: number) => void }) {
  const versions = useNoteVersions(noteId);
  const items = versions.data?.items ?? [];
  const last = items.at(-1)?.number ?? null;
  const right = b ?? last;
  const left = a ?? (right !== null && right > 1 ? right - 1 : right);
  const before = useNoteVersion(noteId, left);
  const after = useNoteVersion(noteId, right);
  const rows = useMemo(() => (before.data && after.data ? diffLines(before.data.markdown, after.data.markdown) : []), [before.data, after.data]);
  const stats = diffStats(rows);

  if (versions.isPending) return <LoadingState label="Loading versions…" />;
  if (versions.isError) return <Alert tone="danger">{describeError(versions.error)}</Alert>;
  const label = (n: number) => {
    const v = items.find((x) => x.number === n);
    return v ? `Version ${v.number} · ${formatDateTime(v.createdAt)}${v.createdBy ? ` · ${v.createdBy}` : ''}${v.isCorrection ? ' · correction' : ''}` : `Version ${n}`;
  };
  return (
    <div className="space-y-4">
      <div className="grid gap-3 sm:grid-cols-2">
        <Select label="Left (older)" value={left ?? ''} onChange={(e) => onChange(Number(e.target.value), right ?? 1)}>
          {items.map((v) => <option key={v.number} value={v.number}>{label(v.number)}</option>)}
        </Select>
        <Select label="Right (newer)" value={right ?? ''} onChange={(e) => onChange(left ?? 1, Number(e.target.value))}>
          {items.map((v) => <option key={v.number} value={v.number}>{label(v.number)}</option>)}
        </Select>
      </div>
      {(before.isError || after.isError) && <Alert tone="danger">{describeError(before.error ?? after.error)}</Alert>}
      {before.data && after.data ? (
        <>
          <p className="text-sm text-ink-700" role="status">
            {stats.removed} line{stats.removed === 1 ? '' : 's'} only on the left, {stats.added} only on the right.
            {before.data.title !== after.data.title && ` Title changed from “${before.data.title}” to “${after.data.title}”.`}
          </p>
          {after.data.correctionNotice && <Alert tone="caution" title="Correction notice">{after.data.correctionNotice}</Alert>}
          <div className="overflow-x-auto rounded-lg border border-ink-200 bg-white">
            <table className="w-full table-fixed border-collapse font-mono text-xs">
              <caption className="sr-only">Line comparison of version {left} and version {right}</caption>
              <thead>
                <tr className="border-b border-ink-300 text-left font-sans text-ink-700">
                  <th scope="col" className="w-10 px-2 py-1">#</th>
                  <th scope="col" className="px-2 py-1">Version {left}</th>
                  <th scope="col" className="w-10 px-2 py-1">#</th>
                  <th scope="col" className="px-2 py-1">Version {right}</th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r, i) => (
                  <tr key={i} className="align-top">
                    <td className="px-2 text-ink-400">{r.leftNumber}</td>
                    <td className={cn('whitespace-pre-wrap px-2 break-words', r.op !== 'same' && r.left !== null && ROW_STYLE.removed)}>
                      {r.op !== 'same' && r.left !== null && <span className="sr-only">Removed: </span>}
                      {r.op !== 'same' && r.left !== null && <span aria-hidden="true" className="text-danger-700">− </span>}
                      {r.left}
                    </td>
                    <td className="px-2 text-ink-400">{r.rightNumber}</td>
                    <td className={cn('whitespace-pre-wrap px-2 break-words', r.op !== 'same' && r.right !== null && ROW_STYLE.added)}>
                      {r.op !== 'same' && r.right !== null && <span className="sr-only">Added: </span>}
                      {r.op !== 'same' && r.right !== null && <span aria-hidden="true" className="text-accent-700">+ </span>}
                      {r.right}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      ) : (
        <LoadingState label="Loading the two versions…" />
      )}
    </div>
  );
}
