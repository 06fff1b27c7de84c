import { zodResolver } from '@hookform/resolvers/zod';
import { pollsterInputSchema, type PollsterDto } from '@veracast/shared-types';
import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Alert, Button, Input, Textarea } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { useCreatePollster } from '../api/create-pollster';
import { useUpdatePollster } from '../api/update-pollster';

/** One alias a line in the form; the server's schema checks the list. */
export function aliasesOf(text: string): string[] {
  return [...new Set(text.split(/\r?\n/).map((line) => line.trim()).filter(Boolean))];
}

/** The form's text fields, checked by the server's pollster schema (aliases issues show on the text box). */
const formSchema = z.object({ name: z.string(), aliasesText: z.string(), notes: z.string() }).transform((v, ctx) => {
  const result = pollsterInputSchema.safeParse({ name: v.name, aliases: aliasesOf(v.aliasesText), notes: v.notes.trim() || null });
  if (result.success) return result.data;
  for (const issue of result.error.issues) {
    const field = issue.path[0] === 'aliases' ? 'aliasesText' : String(issue.path[0] ?? 'name');
    ctx.addIssue({ code: 'custom', path: [field], message: field === 'aliasesText' ? `an alias ${issue.message}` : issue.message });
  }
  return z.NEVER;
});

type FormValues = z.input<typeof formSchema>;
type PollsterInputValues = z.output<typeof formSchema>;

function defaults(pollster?: PollsterDto): FormValues {
  return { name: pollster?.name ?? '', aliasesText: pollster?.aliases.join('\n') ?? '', notes: pollster?.notes ?? '' };
}

export interface PollsterFormProps {
  /** The firm to edit; without it the form creates one. */
  pollster?: PollsterDto;
  onSaved?: (pollster: PollsterDto) => void;
}

/** Creates or edits a polling firm with the names it publishes under. */
export function PollsterForm({ pollster, onSaved }: PollsterFormProps) {
  const create = useCreatePollster();
  const update = useUpdatePollster();
  const mutation = pollster ? update : create;
  const form = useForm<FormValues, unknown, PollsterInputValues>({ resolver: zodResolver(formSchema), defaultValues: defaults(pollster) });
  const { errors } = form.formState;

  useEffect(() => {
    if (pollster) form.reset(defaults(pollster));
  }, [pollster, form]);

  function submit(values: PollsterInputValues) {
    if (pollster) update.mutate({ id: pollster.id, changes: values }, { onSuccess: (saved) => onSaved?.(saved) });
    else
      create.mutate(values, {
        onSuccess: (saved) => {
          form.reset();
          onSaved?.(saved);
        },
      });
  }

  return (
    <form onSubmit={form.handleSubmit(submit)} noValidate className="space-y-4">
      {mutation.isError && <Alert tone="danger">{describeError(mutation.error)}</Alert>}
      {mutation.isSuccess && <Alert tone="success">{pollster ? 'The pollster was saved.' : `Pollster ${mutation.data.name} was created.`}</Alert>}
      <Input label="Firm name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
      <Textarea
        label="Aliases"
        rows={3}
        hint="Other spellings the firm's polls appear under, one a line. Imports match them to this firm."
        error={errors.aliasesText?.message}
        {...form.register('aliasesText')}
      />
      <Textarea label="Notes" rows={2} error={errors.notes?.message} {...form.register('notes')} />
      <Button type="submit" busy={mutation.isPending} busyText="Saving…">
        {pollster ? 'Save pollster' : 'Create pollster'}
      </Button>
    </form>
  );
}
