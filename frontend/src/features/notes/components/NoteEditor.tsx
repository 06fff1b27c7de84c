import type { NoteDetail } from '@veracast/shared-types';
import { useEffect, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { Alert, Button, Input, LoadingState, Textarea } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { useNotePreview } from '../api/preview-note';
import { updateNoteInputSchema, useUpdateNote } from '../api/update-note';
import { useSubmitNote } from '../api/workflow-actions';
import { AuditStatus } from './AuditStatus';
import { BlockInserter } from './BlockInserter';
import { NoteHtml } from './NoteHtml';

function useDebounced<T>(value: T, ms: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return debounced;
}

/**
 * Markdown on the left, the server's rendering on the right (the same renderer the public page
 * uses). Saving keeps a new version; submitting saves first, then asks for review.
 */
export function NoteEditor({ note, onSubmitted }: { note: NoteDetail; onSubmitted: () => void }) {
  const [title, setTitle] = useState(note.current?.title ?? note.title);
  const [markdown, setMarkdown] = useState(note.current?.markdown ?? '');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saved, setSaved] = useState<string | null>(null);
  const textarea = useRef<HTMLTextAreaElement>(null);
  const debounced = useDebounced(markdown, 400);
  const preview = useNotePreview(debounced, note.can.edit);
  const update = useUpdateNote(note.id);
  const submit = useSubmitNote(note.id);
  const dirty = title !== (note.current?.title ?? note.title) || markdown !== (note.current?.markdown ?? '');

  if (!note.can.edit) {
    return (
      <Alert tone="info" title="This note cannot be edited now">
        Only a draft can be edited, by its author or an admin{note.state === 'published' ? '; a published note takes a correction instead' : ''}.{' '}
        <Link to={paths.note.href(note.id)}>Back to the note</Link>
      </Alert>
    );
  }

  function validate() {
    const parsed = updateNoteInputSchema.safeParse({ title, markdown, electionKey: note.electionKey });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return null;
    }
    setErrors({});
    return parsed.data;
  }

  async function save() {
    const input = validate();
    if (!input) return false;
    const before = note.currentVersion;
    const result = await update.mutateAsync(input);
    setSaved(result.currentVersion !== before ? `Saved as version ${result.currentVersion}.` : 'No change since the last version.');
    return true;
  }

  async function saveAndSubmit() {
    if (dirty && !(await save().catch(() => false))) return;
    await submit.mutateAsync();
    onSubmitted();
  }

  function insert(text: string) {
    const el = textarea.current;
    const at = el ? el.selectionStart : markdown.length;
    const next = markdown.slice(0, at) + text + markdown.slice(at);
    setMarkdown(next);
    requestAnimationFrame(() => {
      el?.focus();
      el?.setSelectionRange(at + text.length, at + text.length);
    });
  }

  return (
    <div className="space-y-4">
      <Input label="Title" value={title} onChange={(e) => setTitle(e.target.value)} error={errors.title} />
      <div className="grid gap-4 lg:grid-cols-2">
        <div className="space-y-3">
          <Textarea
            ref={textarea}
            label="Markdown"
            hint="GitHub-flavoured Markdown; $…$ and $$…$$ for formulas; live blocks in ```veracast fences."
            value={markdown}
            onChange={(e) => setMarkdown(e.target.value)}
            error={errors.markdown}
            rows={26}
            className="font-mono text-[13px]"
            spellCheck
          />
          <BlockInserter onInsert={insert} />
        </div>
        <section aria-labelledby="preview-heading" className="min-w-0 space-y-3">
          <h2 id="preview-heading" className="text-sm font-semibold text-ink-800">
            Preview {preview.isFetching && <span className="font-normal text-ink-500">(updating…)</span>}
          </h2>
          {preview.data && <AuditStatus audits={preview.data.audits} />}
          {preview.isError && <Alert tone="danger">{describeError(preview.error)}</Alert>}
          {preview.data ? (
            <div className="rounded-lg border border-ink-200 bg-white p-5">
              <NoteHtml html={preview.data.html} label="Preview of the note" />
            </div>
          ) : (
            !preview.isError && <LoadingState label="Rendering…" />
          )}
        </section>
      </div>
      {update.isError && <Alert tone="danger">{describeError(update.error)}</Alert>}
      {submit.isError && <Alert tone="danger">{describeError(submit.error)}</Alert>}
      {saved && !update.isError && <Alert tone="success">{saved}</Alert>}
      <div className="flex flex-wrap gap-2">
        <Button onClick={() => void save().catch(() => undefined)} busy={update.isPending} busyText="Saving…">
          Save version
        </Button>
        {note.can.submit && (
          <Button variant="secondary" onClick={() => void saveAndSubmit().catch(() => undefined)} busy={submit.isPending} busyText="Submitting…">
            Submit for review
          </Button>
        )}
        <Link to={paths.note.href(note.id)} className="self-center text-sm font-medium text-accent-700 underline">
          Back to the note
        </Link>
      </div>
    </div>
  );
}
