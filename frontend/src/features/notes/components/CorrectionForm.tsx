import type { NoteDetail } from '@veracast/shared-types';
import { useState } from 'react';
import { Alert, Button, Card, Input, Textarea } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { correctNoteInputSchema, useCorrectNote } from '../api/workflow-actions';

/** A correction is a new published version with a notice and date; earlier versions stay. */
export function CorrectionForm({ note }: { note: NoteDetail }) {
  const [open, setOpen] = useState(false);
  const [markdown, setMarkdown] = useState(note.current?.markdown ?? '');
  const [notice, setNotice] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const correct = useCorrectNote(note.id);

  if (!open) {
    return (
      <Button variant="secondary" onClick={() => setOpen(true)}>
        Publish a correction…
      </Button>
    );
  }

  function submit() {
    const parsed = correctNoteInputSchema.safeParse({ markdown, notice });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    correct.mutate(parsed.data, { onSuccess: () => { setOpen(false); setNotice(''); } });
  }

  return (
    <Card title="Publish a correction" description="The corrected text is published at once as a new version; the notice and today’s date appear on the public page and in the PDF.">
      <div className="space-y-3">
        <Input label="Correction notice" hint="What was corrected and why." value={notice} onChange={(e) => setNotice(e.target.value)} error={errors.notice} />
        <Textarea label="Corrected Markdown" value={markdown} onChange={(e) => setMarkdown(e.target.value)} error={errors.markdown} rows={14} className="font-mono text-[13px]" />
        {correct.isError && <Alert tone="danger">{describeError(correct.error)}</Alert>}
        <div className="flex gap-2">
          <Button onClick={submit} busy={correct.isPending} busyText="Publishing…">
            Publish correction
          </Button>
          <Button variant="ghost" onClick={() => setOpen(false)}>
            Cancel
          </Button>
        </div>
      </div>
    </Card>
  );
}
