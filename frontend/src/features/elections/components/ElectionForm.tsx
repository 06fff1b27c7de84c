import { zodResolver } from '@hookform/resolvers/zod';
import { electionInputSchema, type ElectionDto, type ElectionInput } from '@veracast/shared-types';
import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { Alert, Button, Input } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { useCreateElection } from '../api/create-election';
import { useUpdateElection } from '../api/update-election';

const emptyToNull = (value: unknown) => (value === '' || value === undefined ? null : value);

function defaults(election?: ElectionDto): ElectionInput {
  return {
    key: election?.key ?? '',
    name: election?.name ?? '',
    date: election?.date ?? '',
    jurisdiction: election?.jurisdiction ?? '',
    blackoutStart: election?.blackoutStart ?? null,
    blackoutEnd: election?.blackoutEnd ?? null,
  };
}

export interface ElectionFormProps {
  /** The election to edit; without it the form creates one. */
  election?: ElectionDto;
  onSaved?: (election: ElectionDto) => void;
}

/** Creates or edits an election, validated with the server's own schema. */
export function ElectionForm({ election, onSaved }: ElectionFormProps) {
  const create = useCreateElection();
  const update = useUpdateElection();
  const mutation = election ? update : create;
  const form = useForm<ElectionInput>({ resolver: zodResolver(electionInputSchema), defaultValues: defaults(election) });
  const { errors } = form.formState;

  // The saved election comes back from the server: show what is stored.
  useEffect(() => {
    if (election) form.reset(defaults(election));
  }, [election, form]);

  function submit(values: ElectionInput) {
    if (election) {
      const { key: _key, ...changes } = values;
      update.mutate({ key: election.key, changes }, { onSuccess: (saved) => onSaved?.(saved) });
    } else {
      create.mutate(values, {
        onSuccess: (saved) => {
          form.reset();
          onSaved?.(saved);
        },
      });
    }
  }

  return (
    <form onSubmit={form.handleSubmit(submit)} noValidate className="space-y-4">
      {mutation.isError && <Alert tone="danger">{describeError(mutation.error)}</Alert>}
      {mutation.isSuccess && election && <Alert tone="success">The election was saved.</Alert>}
      <div className="grid gap-4 sm:grid-cols-2">
        <Input
          label="Election key"
          hint="Lower-case letters, digits, dot, dash or underscore, e.g. cal-2026-general."
          disabled={Boolean(election)}
          autoComplete="off"
          error={errors.key?.message}
          {...form.register('key')}
        />
        <Input label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
        <Input label="Election day" type="date" error={errors.date?.message} {...form.register('date')} />
        <Input label="Jurisdiction" autoComplete="off" error={errors.jurisdiction?.message} {...form.register('jurisdiction')} />
        <Input
          label="Blackout starts"
          type="date"
          hint="First day on which publishing polls is forbidden; leave empty when there is none."
          error={errors.blackoutStart?.message}
          {...form.register('blackoutStart', { setValueAs: emptyToNull })}
        />
        <Input
          label="Blackout ends"
          type="date"
          error={errors.blackoutEnd?.message}
          {...form.register('blackoutEnd', { setValueAs: emptyToNull })}
        />
      </div>
      <Button type="submit" busy={mutation.isPending} busyText="Saving…">
        {election ? 'Save election' : 'Create election'}
      </Button>
    </form>
  );
}
