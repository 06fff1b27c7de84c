import { CONTEST_KINDS, contestInputSchema, type ContestDto } from '@veracast/shared-types';
import { useMemo } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { Alert, Button, Input, Select } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { useCreateContest } from '../api/create-contest';
import { numberOrNull, schemaResolver, textOrNull } from '../forms/schema-resolver';

export interface ContestFormValues {
  key: string;
  name: string;
  kind: string;
  electorate: string;
  rejectedBallots: string;
  options: { key: string; name: string; bloc: string }[];
}

export function contestInputOf(values: ContestFormValues, electionKey: string) {
  return {
    key: values.key.trim(),
    electionKey,
    name: values.name,
    kind: values.kind,
    electorate: numberOrNull(values.electorate),
    rejectedBallots: numberOrNull(values.rejectedBallots),
    options: values.options.map((o) => ({ key: o.key.trim(), name: o.name, bloc: textOrNull(o.bloc) })),
  };
}

const blankOption = () => ({ key: '', name: '', bloc: '' });

export interface ContestFormProps {
  electionKey: string;
  onCreated?: (contest: ContestDto) => void;
}

/** Adds a contest with its options to an election; its result is entered on the contest's page. */
export function ContestForm({ electionKey, onCreated }: ContestFormProps) {
  const create = useCreateContest();
  const resolver = useMemo(
    () => schemaResolver<ContestFormValues, typeof contestInputSchema>(contestInputSchema, (values) => contestInputOf(values, electionKey)),
    [electionKey],
  );
  const form = useForm<ContestFormValues>({
    resolver,
    defaultValues: { key: '', name: '', kind: 'candidate', electorate: '', rejectedBallots: '', options: [blankOption(), blankOption()] },
  });
  const options = useFieldArray({ control: form.control, name: 'options' });
  const { errors } = form.formState;
  const optionsError = errors.options?.root?.message ?? (errors.options as { message?: string } | undefined)?.message;

  return (
    <form
      onSubmit={form.handleSubmit((values) =>
        create.mutate(contestInputSchema.parse(contestInputOf(values, electionKey)), {
          onSuccess: (contest) => {
            form.reset();
            onCreated?.(contest);
          },
        }),
      )}
      noValidate
      className="space-y-4"
    >
      {create.isError && <Alert tone="danger" title="The contest was not created">{describeError(create.error)}</Alert>}
      {create.isSuccess && <Alert tone="success">Contest {create.data.name} was added.</Alert>}
      <div className="grid gap-4 sm:grid-cols-2">
        <Input label="Contest key" autoComplete="off" error={errors.key?.message} {...form.register('key')} />
        <Input label="Contest name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
        <Select label="Kind" error={errors.kind?.message} {...form.register('kind')}>
          {CONTEST_KINDS.map((k) => (
            <option key={k} value={k}>
              {k === 'referendum' ? 'Referendum question' : 'Race between candidates or lists'}
            </option>
          ))}
        </Select>
        <Input label="Electorate" inputMode="numeric" hint="Registered voters, for turnout; optional." error={errors.electorate?.message} {...form.register('electorate')} />
        <Input label="Rejected ballots" inputMode="numeric" error={errors.rejectedBallots?.message} {...form.register('rejectedBallots')} />
      </div>
      <fieldset className="space-y-3">
        <legend className="text-sm font-semibold text-ink-900">Options</legend>
        <p className="text-sm text-ink-600">
          At least two. A bloc is a label shared across contests (a party, or YES/NO) that orients margins; leave it empty for
          independents.
        </p>
        {optionsError && <p className="text-sm font-medium text-danger-700">Options: {optionsError}</p>}
        {options.fields.map((field, index) => (
          <div key={field.id} className="grid items-end gap-3 sm:grid-cols-[1fr_2fr_1fr_auto]">
            <Input label={`Option ${index + 1} key`} autoComplete="off" error={errors.options?.[index]?.key?.message} {...form.register(`options.${index}.key`)} />
            <Input label={`Option ${index + 1} name`} autoComplete="off" error={errors.options?.[index]?.name?.message} {...form.register(`options.${index}.name`)} />
            <Input label={`Option ${index + 1} bloc`} autoComplete="off" error={errors.options?.[index]?.bloc?.message} {...form.register(`options.${index}.bloc`)} />
            <Button variant="ghost" size="sm" onClick={() => options.remove(index)} disabled={options.fields.length <= 2} aria-label={`Remove option ${index + 1}`}>
              Remove
            </Button>
          </div>
        ))}
        <Button variant="secondary" size="sm" onClick={() => options.append(blankOption())}>
          Add an option
        </Button>
      </fieldset>
      <Button type="submit" busy={create.isPending} busyText="Creating…">
        Create contest
      </Button>
    </form>
  );
}
