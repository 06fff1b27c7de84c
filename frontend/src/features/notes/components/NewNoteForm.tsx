import { useState, type FormEvent } from 'react';
import { Alert, Button, Input } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { createNoteInputSchema, useCreateNote } from '../api/create-note';

const STARTER = `# Title of the note

What was measured, over which polls, and how.

Cite an audit with a live block, for example:

\`\`\`veracast
audit: 1
view: headline
\`\`\`
`;

/** Starts a draft; the editor opens next. */
export function NewNoteForm({ onCreated }: { onCreated: (id: number) => void }) {
  const create = useCreateNote();
  const [title, setTitle] = useState('');
  const [electionKey, setElectionKey] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});

  function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = createNoteInputSchema.safeParse({ title, markdown: STARTER, electionKey: electionKey.trim() || null });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, { onSuccess: (note) => onCreated(note.id) });
  }

  return (
    <form onSubmit={submit} className="max-w-xl space-y-4" noValidate>
      <Input label="Title" value={title} onChange={(e) => setTitle(e.target.value)} error={errors.title} required />
      <Input
        label="Election key (optional)"
        hint="Lets readers filter notes by election, e.g. cal-2026-general."
        value={electionKey}
        onChange={(e) => setElectionKey(e.target.value)}
        error={errors.electionKey}
      />
      {create.isError && <Alert tone="danger">{describeError(create.error)}</Alert>}
      <Button type="submit" busy={create.isPending} busyText="Creating…">
        Create draft
      </Button>
    </form>
  );
}
