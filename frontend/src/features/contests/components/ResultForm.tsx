import { RESULT_STATUSES, resultInputSchema, type ResultStatus } from '@veracast/shared-types';
import { useEffect, useMemo } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { Alert, Button, Input, Select, Textarea } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import type { ContestDetail } from '../api/get-contest';
import { useSaveResult } from '../api/save-result';
import { numberOrNull, schemaResolver, textOrNull } from '../forms/schema-resolver';

export interface ResultFormValues {
  status: ResultStatus;
  certifiedOn: string;
  certifyingBody: string;
  sourceUrl: string;
  votes: { key: string; name: string; votes: string }[];
  reason: string;
}

/** The server's result schema, plus the rule that a change to a certified result states why. */
export function resultFormSchema(wasCertified: boolean) {
  return resultInputSchema.superRefine((value, ctx) => {
    if (wasCertified && !value.reason) {
      ctx.addIssue({ code: 'custom', path: ['reason'], message: 'changing a certified result needs a reason' });
    }
  });
}

export function resultInputOf(values: ResultFormValues) {
  const votes: Record<string, number> = {};
  for (const row of values.votes) {
    const n = numberOrNull(row.votes);
    if (n !== null) votes[row.key] = n;
  }
  return {
    status: values.status,
    certifiedOn: textOrNull(values.certifiedOn),
    certifyingBody: textOrNull(values.certifyingBody),
    sourceUrl: textOrNull(values.sourceUrl),
    votes,
    reason: values.reason.trim() || undefined,
  };
}

function defaults(contest: ContestDetail): ResultFormValues {
  return {
    status: contest.status ?? 'provisional',
    certifiedOn: contest.certifiedOn ?? '',
    certifyingBody: contest.certifyingBody ?? '',
    sourceUrl: contest.sourceUrl ?? '',
    votes: contest.options.map((o) => ({ key: o.key, name: o.name, votes: o.votes === null ? '' : String(o.votes) })),
    reason: '',
  };
}

export interface ResultFormProps {
  contest: ContestDetail;
  /** The signed-in user is a reviewer (or admin): may certify and change a certified result. */
  canCertify: boolean;
}

/**
 * Enters or corrects a contest's result. An analyst enters provisional results; certifying needs
 * the reviewer role and a source; a change to a certified result needs a reason and lands in the
 * change log with its before and after values.
 */
export function ResultForm({ contest, canCertify }: ResultFormProps) {
  const save = useSaveResult();
  const wasCertified = contest.status === 'certified';
  const resolver = useMemo(
    () =>
      schemaResolver<ResultFormValues, ReturnType<typeof resultFormSchema>>(resultFormSchema(wasCertified), resultInputOf, (path, values) => {
        if (path[0] === 'votes' && path.length > 1) {
          const index = values.votes.findIndex((row) => row.key === path[1]);
          return index >= 0 ? `votes.${index}.votes` : 'votes';
        }
        return path.map(String).join('.');
      }),
    [wasCertified],
  );
  const form = useForm<ResultFormValues>({ resolver, defaultValues: defaults(contest) });
  const rows = useFieldArray({ control: form.control, name: 'votes', keyName: 'fieldId' });
  const { errors } = form.formState;
  const status = form.watch('status');

  // A saved change comes back as a new contest object: start again from the stored values.
  useEffect(() => form.reset(defaults(contest)), [contest, form]);

  if (wasCertified && !canCertify) {
    return (
      <Alert tone="info" title="This result is certified">
        Changing a certified result needs the reviewer role. Ask a reviewer if a figure is wrong; every change is kept in the
        history below with its reason.
      </Alert>
    );
  }

  return (
    <form
      onSubmit={form.handleSubmit((values) =>
        save.mutate(
          { contestKey: contest.key, result: resultFormSchema(wasCertified).parse(resultInputOf(values)) },
          { onSuccess: () => form.setValue('reason', '') },
        ),
      )}
      noValidate
      className="space-y-4"
    >
      {save.isError && <Alert tone="danger" title="The result was not saved">{describeError(save.error)}</Alert>}
      {save.isSuccess && <Alert tone="success">The result was saved and the change logged.</Alert>}
      {wasCertified && (
        <Alert tone="caution" title="You are changing a certified result">
          Say why. The change log keeps the values before and after, your name and your reason; audits made before stay as they
          were.
        </Alert>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <Select
          label="Status"
          error={errors.status?.message}
          hint={canCertify ? 'Certifying needs the certification date and a source.' : 'Only a reviewer may mark a result certified.'}
          {...form.register('status')}
        >
          {RESULT_STATUSES.map((s) => (
            <option key={s} value={s} disabled={s === 'certified' && !canCertify}>
              {s === 'certified' ? 'Certified' : 'Provisional'}
            </option>
          ))}
        </Select>
        <Input label="Certified on" type="date" error={errors.certifiedOn?.message} {...form.register('certifiedOn')} />
        <Input
          label="Source (URL of the official result)"
          type="url"
          required={status === 'certified'}
          error={errors.sourceUrl?.message}
          {...form.register('sourceUrl')}
        />
        <Input label="Certifying body" autoComplete="off" error={errors.certifyingBody?.message} {...form.register('certifyingBody')} />
      </div>
      <fieldset className="space-y-3">
        <legend className="text-sm font-semibold text-ink-900">Votes per option</legend>
        {(errors.votes?.root?.message ?? errors.votes?.message) && (
          <p className="text-sm font-medium text-danger-700">{errors.votes?.root?.message ?? errors.votes?.message}</p>
        )}
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {rows.fields.map((row, index) => (
            <Input
              key={row.fieldId}
              label={`Votes for ${row.name}`}
              inputMode="numeric"
              autoComplete="off"
              error={errors.votes?.[index]?.votes?.message}
              {...form.register(`votes.${index}.votes`)}
            />
          ))}
        </div>
      </fieldset>
      <Textarea
        label={wasCertified ? 'Reason for the change (required)' : 'Reason or note (optional)'}
        rows={2}
        error={errors.reason?.message}
        {...form.register('reason')}
      />
      <Button type="submit" busy={save.isPending} busyText="Saving…">
        {status === 'certified' && !wasCertified ? 'Certify result' : 'Save result'}
      </Button>
    </form>
  );
}
