import type { NoteDetail } from '@veracast/shared-types';
import { useState } from 'react';
import { Alert, Button, Card, Textarea } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { returnNoteInputSchema, usePublishNote, useReturnNote } from '../api/workflow-actions';

/** Approve and publish, or return with comments. Shown only to a reviewer who is not the author. */
export function ReviewPanel({ note }: { note: NoteDetail }) {
  const [comments, setComments] = useState('');
  const [error, setError] = useState<string | undefined>();
  const publish = usePublishNote(note.id);
  const ret = useReturnNote(note.id);

  function doReturn() {
    const parsed = returnNoteInputSchema.safeParse({ comments });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message);
      return;
    }
    setError(undefined);
    ret.mutate(parsed.data.comments, { onSuccess: () => setComments('') });
  }

  return (
    <Card title="Review" description={`Version ${note.currentVersion} by ${note.author.name}. Publishing makes this version public, with its PDF; it cannot be edited afterwards.`}>
      <div className="space-y-3">
        <Textarea label="Review comments" hint="Required when you return the note; optional when you publish it." value={comments} onChange={(e) => setComments(e.target.value)} error={error} rows={5} />
        {(publish.isError || ret.isError) && <Alert tone="danger">{describeError(publish.error ?? ret.error)}</Alert>}
        <div className="flex flex-wrap gap-2">
          <Button onClick={() => publish.mutate(comments.trim() || undefined)} busy={publish.isPending} busyText="Publishing…">
            Approve and publish
          </Button>
          <Button variant="secondary" onClick={doReturn} busy={ret.isPending} busyText="Returning…">
            Return to author
          </Button>
        </div>
      </div>
    </Card>
  );
}
