import type { NoteDetail } from '@veracast/shared-types';
import { Link } from 'react-router-dom';
import { Alert, Button, Card, LinkButton } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { formatDateTime } from '../../../utils/format';
import { useSubmitNote } from '../api/workflow-actions';
import { AuditStatus } from './AuditStatus';
import { CorrectionForm } from './CorrectionForm';
import { NoteHtml } from './NoteHtml';
import { NoteStateLabel } from './NoteStateLabel';
import { ReviewPanel } from './ReviewPanel';

/** A note's current version as rendered, with what the signed-in user may do next and the review history. */
export function NoteView({ note }: { note: NoteDetail }) {
  const submit = useSubmitNote(note.id);
  const returned = note.state === 'draft' ? [...note.reviews].reverse().find((r) => r.decision === 'returned') : undefined;
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2 text-sm text-ink-700">
        <NoteStateLabel state={note.state} />
        <span>By {note.author.name}</span>
        <span>Version {note.currentVersion} of {note.versionCount}</span>
        {note.electionKey && <span>Election {note.electionKey}</span>}
        {note.publishedAt && <span>Published {formatDateTime(note.publishedAt)}</span>}
      </div>
      <div className="flex flex-wrap gap-2">
        {note.can.edit && <LinkButton to={paths.noteEdit.href(note.id)} variant="primary">Edit</LinkButton>}
        {note.can.submit && (
          <Button variant="secondary" onClick={() => submit.mutate()} busy={submit.isPending} busyText="Submitting…">
            Submit for review
          </Button>
        )}
        {note.versionCount > 1 && <LinkButton to={paths.noteVersions.href(note.id)}>Compare versions</LinkButton>}
        {note.publicPath && <LinkButton to={note.publicPath}>Public page</LinkButton>}
      </div>
      {submit.isError && <Alert tone="danger">{describeError(submit.error)}</Alert>}
      {returned && (
        <Alert tone="caution" title={`Returned by ${returned.reviewer ?? 'a reviewer'} on ${formatDateTime(returned.createdAt)}`}>
          <p className="whitespace-pre-wrap">{returned.comments}</p>
        </Alert>
      )}
      {note.state === 'in_review' && !note.can.review && (
        <Alert tone="info">This note waits for a reviewer other than its author.</Alert>
      )}
      <AuditStatus audits={note.audits} />
      {note.can.review && <ReviewPanel note={note} />}
      {note.current && (
        <article className="rounded-lg border border-ink-200 bg-white p-6" aria-label={`Version ${note.current.number}`}>
          {note.current.isCorrection && (
            <p className="mb-4 text-sm text-caution-900">
              <strong>Correction ({formatDateTime(note.current.createdAt)}):</strong> {note.current.correctionNotice}
            </p>
          )}
          <NoteHtml html={note.current.html} />
        </article>
      )}
      {note.can.correct && <CorrectionForm note={note} />}
      <Card title="Review history">
        {note.reviews.length === 0 ? (
          <p className="text-sm text-ink-600">No review yet.</p>
        ) : (
          <ol className="space-y-3">
            {note.reviews.map((r) => (
              <li key={r.id} className="text-sm">
                <p className="font-medium text-ink-900">
                  {r.decision === 'approved' ? 'Approved and published' : 'Returned to draft'} by {r.reviewer ?? 'a former user'} · version {r.versionNumber} ·{' '}
                  {formatDateTime(r.createdAt)}
                </p>
                {r.comments && <p className="mt-1 whitespace-pre-wrap text-ink-700">{r.comments}</p>}
              </li>
            ))}
          </ol>
        )}
        <p className="mt-4 text-sm">
          <Link to={paths.notes.href()} className="font-medium text-accent-700 underline">
            All notes
          </Link>
        </p>
      </Card>
    </div>
  );
}
