import type { PublicNote } from '@veracast/shared-types';
import { formatDate } from '../../../utils/format';
import { NoteHtml } from './NoteHtml';
import { FictionalDataLabel } from '../../../components/ui';

/** The public page of a published note: no app shell, readable signed out. */
export function PublicNoteView({ note }: { note: PublicNote }) {
  const lastCorrection = note.corrections.at(-1);
  return (
    <article className="space-y-6">
      <header className="space-y-2">
        <p className="text-sm font-medium uppercase tracking-wide text-accent-800">Methodology note</p>
        <h1 className="text-3xl font-semibold tracking-tight text-ink-950">{note.title}</h1>
        <p className="text-sm text-ink-600">
          Published {formatDate(note.publishedAt)} · version {note.version}
          {lastCorrection && ` · corrected ${formatDate(lastCorrection.date)}`}
        </p>
        {note.fictional && <FictionalDataLabel />}
        <p>
          <a href={note.pdfPath} className="text-sm font-medium text-accent-700 underline" download>
            Download as PDF
          </a>
        </p>
      </header>
      {lastCorrection && (
        <p className="rounded-md border border-caution-200 bg-caution-50 px-4 py-3 text-sm text-caution-900">
          <strong>Corrected {formatDate(lastCorrection.date)}:</strong> {lastCorrection.notice}
        </p>
      )}
      <div className="rounded-lg border border-ink-200 bg-white p-6">
        <NoteHtml html={note.html} />
      </div>
      <section aria-labelledby="data-heading" className="space-y-2">
        <h2 id="data-heading" className="text-lg font-semibold text-ink-950">Data behind this note</h2>
        {note.audits.length === 0 ? (
          <p className="text-sm text-ink-700">This note cites no audit.</p>
        ) : (
          <ul className="space-y-2 text-sm">
            {note.audits.map((a) => (
              <li key={a.id}>
                Audit #{a.id} “{a.name}”, computed {formatDate(a.createdAt)} with core {a.coreVersion}. Data hash:{' '}
                <code className="break-all rounded bg-ink-100 px-1 font-mono text-xs">{a.dataHash}</code>
              </li>
            ))}
          </ul>
        )}
        <p className="text-sm text-ink-600">The figures come from these frozen audits; the hash identifies the exact data they were computed from.</p>
      </section>
      <section aria-labelledby="corrections-heading" className="space-y-2">
        <h2 id="corrections-heading" className="text-lg font-semibold text-ink-950">Correction history</h2>
        {note.corrections.length === 0 ? (
          <p className="text-sm text-ink-700">No correction since publication.</p>
        ) : (
          <ol className="list-decimal space-y-1 pl-5 text-sm">
            {note.corrections.map((c) => (
              <li key={c.version}>
                {formatDate(c.date)} (version {c.version}): {c.notice}
              </li>
            ))}
          </ol>
        )}
      </section>
      <section aria-labelledby="cautions-heading" className="space-y-2">
        <h2 id="cautions-heading" className="text-lg font-semibold text-ink-950">Reading these figures</h2>
        <ul className="list-disc space-y-1 pl-5 text-sm text-ink-800">
          {note.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </section>
    </article>
  );
}
