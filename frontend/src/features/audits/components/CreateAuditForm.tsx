import { zodResolver } from '@hookform/resolvers/zod';
import { UNDECIDED_TREATMENTS, type AuditDto, type ElectionDto } from '@veracast/shared-types';
import { useId, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { Alert, Button, FictionalDataLabel, Input, LoadingState, Select } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { formatDate } from '../../../utils/format';
import { createAuditInputSchema, useCreateAudit } from '../api/create-audit';
import { useElectionChoices } from '../api/list-election-choices';
import { formatCount } from '../format';
import { METHOD_ANCHORS } from '../method-catalogue';
import { SETTING_HELP, UNDECIDED_LABELS } from '../settings-text';
import { FormulaLink } from './FormulaLink';

function plural(count: number, noun: string): string {
  return `${formatCount(count)} ${count === 1 ? noun : `${noun}s`}`;
}

/** zod's message for an empty number field is technical; say what to type instead. */
function numberError(message: string | undefined): string | undefined {
  if (!message) return undefined;
  return /expected number/i.test(message) ? 'Enter a number' : message;
}

function ElectionChoices({
  elections,
  value,
  onChange,
  error,
}: {
  elections: ElectionDto[];
  value: string[];
  onChange: (keys: string[]) => void;
  error?: string;
}) {
  const id = useId();
  const chosen = new Set(value);
  return (
    <fieldset aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`} className="space-y-2">
      <legend className="text-sm font-medium text-ink-800">Elections</legend>
      <p id={`${id}-hint`} className="text-sm text-ink-600">
        {SETTING_HELP.elections}
      </p>
      <div className="flex gap-2">
        <Button size="sm" variant="ghost" onClick={() => onChange(elections.map((e) => e.key))}>
          Choose all
        </Button>
        <Button size="sm" variant="ghost" onClick={() => onChange([])}>
          Clear
        </Button>
      </div>
      <ul className="max-h-80 space-y-1 overflow-auto rounded-md border border-ink-200 bg-white p-2">
        {elections.map((e) => (
          <li key={e.key}>
            <label className="flex cursor-pointer items-start gap-3 rounded px-2 py-1.5 hover:bg-ink-50">
              <input
                type="checkbox"
                className="mt-1"
                checked={chosen.has(e.key)}
                onChange={(event) =>
                  onChange(event.target.checked ? [...value, e.key] : value.filter((key) => key !== e.key))
                }
              />
              <span className="min-w-0">
                <span className="font-medium text-ink-900">{e.name}</span>{' '}
                <span className="text-sm text-ink-600">
                  {formatDate(e.date)} · {plural(e.contestCount, 'contest')} · {plural(e.pollCount, 'poll')}
                  {e.certifiedCount < e.contestCount && ` · ${formatCount(e.contestCount - e.certifiedCount)} without a certified result`}
                </span>
                {e.fictional && <FictionalDataLabel className="ml-2 align-middle text-xs" />}
              </span>
            </label>
          </li>
        ))}
      </ul>
      {error && (
        <p id={`${id}-error`} className="text-sm font-medium text-danger-700">
          <span aria-hidden="true">✕ </span>
          {error}
        </p>
      )}
    </fieldset>
  );
}

/** Elections typed by key, for when the list of elections cannot be loaded. */
function ElectionKeysInput({ value, onChange, error }: { value: string[]; onChange: (keys: string[]) => void; error?: string }) {
  const [text, setText] = useState(value.join(', '));
  return (
    <Input
      label="Election keys"
      hint="Separate keys with commas, e.g. cal-2026-general."
      value={text}
      error={error}
      onChange={(event) => {
        setText(event.target.value);
        onChange(
          event.target.value
            .split(',')
            .map((key) => key.trim())
            .filter(Boolean),
        );
      }}
    />
  );
}

export interface CreateAuditFormProps {
  onCreated: (audit: AuditDto) => void;
}

/** The settings of a new audit, each explained in one line. */
export function CreateAuditForm({ onCreated }: CreateAuditFormProps) {
  const finalOnlyHintId = useId();
  const create = useCreateAudit();
  const elections = useElectionChoices();
  const form = useForm({
    resolver: zodResolver(createAuditInputSchema),
    defaultValues: {
      name: '',
      electionKeys: [] as string[],
      windowDays: 21,
      finalOnly: true,
      undecided: 'raw' as const,
      minPolls: 5,
      designEffect: 1,
    },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) => {
    create.mutate(values, { onSuccess: onCreated });
  });

  const electionsError = errors.electionKeys?.message ?? errors.electionKeys?.root?.message;

  return (
    <form onSubmit={onSubmit} noValidate className="max-w-3xl space-y-6">
      {create.isError && <Alert tone="danger" title="The audit was not created">{describeError(create.error)}</Alert>}

      <Input label="Audit name" autoComplete="off" hint={SETTING_HELP.name} error={errors.name?.message} {...form.register('name')} />

      <Controller
        control={form.control}
        name="electionKeys"
        render={({ field }) =>
          elections.isPending ? (
            <LoadingState label="Loading elections…" />
          ) : elections.isError ? (
            <div className="space-y-3">
              <Alert tone="danger" title="The list of elections could not be loaded">
                {describeError(elections.error)} You can still type the keys of the elections to audit.
              </Alert>
              <ElectionKeysInput value={field.value} onChange={field.onChange} error={electionsError} />
            </div>
          ) : elections.data.length === 0 ? (
            <Alert tone="info" title="No elections yet">
              Import certified results first; an audit compares polls with them.
            </Alert>
          ) : (
            <ElectionChoices elections={elections.data} value={field.value} onChange={field.onChange} error={electionsError} />
          )
        }
      />

      <div className="grid gap-5 sm:grid-cols-2">
        <Input
          label="Window (days before election day)"
          type="number"
          min={0}
          max={3650}
          step={1}
          inputMode="numeric"
          hint={
            <>
              {SETTING_HELP.windowDays} <FormulaLink anchor={METHOD_ANCHORS.window} />
            </>
          }
          error={numberError(errors.windowDays?.message)}
          {...form.register('windowDays', { valueAsNumber: true })}
        />
        <div className="flex flex-col gap-1.5">
          <span className="text-sm font-medium text-ink-800" aria-hidden="true">
            Polls counted
          </span>
          <label className="flex h-10 items-center gap-2 text-sm text-ink-900">
            <input type="checkbox" aria-describedby={finalOnlyHintId} {...form.register('finalOnly')} />
            Final poll of each pollster per contest only
          </label>
          <p id={finalOnlyHintId} className="text-sm text-ink-600">
            {SETTING_HELP.finalOnly} <FormulaLink anchor={METHOD_ANCHORS.finalPoll} />
          </p>
        </div>
        <Select
          label="Undecided treatment"
          hint={
            <>
              {SETTING_HELP.undecided} <FormulaLink anchor={METHOD_ANCHORS.undecided} />
            </>
          }
          error={errors.undecided?.message}
          {...form.register('undecided')}
        >
          {UNDECIDED_TREATMENTS.map((treatment) => (
            <option key={treatment} value={treatment}>
              {UNDECIDED_LABELS[treatment]}
            </option>
          ))}
        </Select>
        <Input
          label="Design effect"
          type="number"
          min={1}
          max={10}
          step={0.05}
          inputMode="decimal"
          hint={
            <>
              {SETTING_HELP.designEffect} <FormulaLink anchor={METHOD_ANCHORS.designEffect} />
            </>
          }
          error={numberError(errors.designEffect?.message)}
          {...form.register('designEffect', { valueAsNumber: true })}
        />
        <Input
          label="Minimum polls to rank a pollster"
          type="number"
          min={1}
          max={1000}
          step={1}
          inputMode="numeric"
          hint={
            <>
              {SETTING_HELP.minPolls} <FormulaLink anchor={METHOD_ANCHORS.minPolls} />
            </>
          }
          error={numberError(errors.minPolls?.message)}
          {...form.register('minPolls', { valueAsNumber: true })}
        />
      </div>

      <div className="flex items-center gap-3">
        <Button type="submit" busy={create.isPending} busyText="Computing the audit…">
          Create audit
        </Button>
        <p className="text-sm text-ink-600">The audit is computed now and frozen: later data changes never alter it.</p>
      </div>
    </form>
  );
}
