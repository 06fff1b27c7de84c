import {
  MODES,
  POPULATIONS,
  POPULATION_LABELS,
  SPONSOR_TYPES,
  SPONSOR_TYPE_LABELS,
  pollInputSchema,
  type ContestDto,
  type PollDto,
} from '@veracast/shared-types';
import { useMemo } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { Alert, Button, Input, Select } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { useSavePoll } from '../api/save-poll';
import { numberOrNull, schemaResolver, textOrNull } from '../forms/schema-resolver';

export interface PollFormValues {
  key: string;
  pollsterId: string;
  sponsor: string;
  sponsorType: string;
  fieldworkStart: string;
  fieldworkEnd: string;
  publishedOn: string;
  sampleSize: string;
  population: string;
  mode: string;
  moe: string;
  studyKey: string;
  isHeadline: boolean;
  tracking: boolean;
  sourceUrl: string;
  questionWording: boolean;
  weightingStatement: boolean;
  tablesUrl: string;
  shares: { key: string; label: string; share: string }[];
}

export function pollInputOf(values: PollFormValues, contestKey: string) {
  const shares: Record<string, number> = {};
  for (const row of values.shares) {
    const share = numberOrNull(row.share);
    if (share !== null) shares[row.key] = share;
  }
  return {
    key: values.key.trim(),
    pollsterId: Number(values.pollsterId || 0),
    sponsor: textOrNull(values.sponsor),
    sponsorType: textOrNull(values.sponsorType),
    contestKey,
    fieldworkStart: values.fieldworkStart,
    fieldworkEnd: values.fieldworkEnd,
    publishedOn: values.publishedOn,
    sampleSize: numberOrNull(values.sampleSize) ?? Number.NaN,
    population: values.population,
    mode: values.mode,
    moe: numberOrNull(values.moe),
    studyKey: textOrNull(values.studyKey),
    isHeadline: values.isHeadline,
    tracking: values.tracking,
    sourceUrl: textOrNull(values.sourceUrl),
    questionWording: values.questionWording,
    weightingStatement: values.weightingStatement,
    tablesUrl: textOrNull(values.tablesUrl),
    shares,
  };
}

function shareRows(contest: ContestDto, poll?: PollDto) {
  const rows = [
    ...contest.options.map((o) => ({ key: o.key, label: o.name })),
    { key: 'other', label: 'Other' },
    { key: 'undecided', label: 'Undecided (don’t know, refused)' },
  ].filter((row, i, all) => all.findIndex((r) => r.key === row.key) === i);
  return rows.map((row) => ({ ...row, share: poll?.shares[row.key] === undefined ? '' : String(poll.shares[row.key]) }));
}

function defaults(contest: ContestDto, poll?: PollDto): PollFormValues {
  return {
    key: poll?.key ?? '',
    pollsterId: poll ? String(poll.pollsterId) : '',
    sponsor: poll?.sponsor ?? '',
    sponsorType: poll?.sponsorType ?? '',
    fieldworkStart: poll?.fieldworkStart ?? '',
    fieldworkEnd: poll?.fieldworkEnd ?? '',
    publishedOn: poll?.publishedOn ?? '',
    sampleSize: poll ? String(poll.sampleSize) : '',
    population: poll?.population ?? 'lv',
    mode: poll?.mode ?? 'online',
    moe: poll?.moe === null || poll?.moe === undefined ? '' : String(poll.moe),
    studyKey: poll?.studyKey ?? '',
    isHeadline: poll?.isHeadline ?? true,
    tracking: poll?.tracking ?? false,
    sourceUrl: poll?.sourceUrl ?? '',
    questionWording: poll?.questionWording ?? false,
    weightingStatement: poll?.weightingStatement ?? false,
    tablesUrl: poll?.tablesUrl ?? '',
    shares: shareRows(contest, poll),
  };
}

export interface PollFormProps {
  contest: ContestDto;
  /** The firms to choose from, as the pollsters list gives them. */
  pollsters: { id: number; name: string }[];
  /** The poll to edit; without it the form adds a poll to the contest. */
  poll?: PollDto;
  onDone?: () => void;
}

/** Adds or edits one poll of the contest with its shares, checked with the server's poll schema. */
export function PollForm({ contest, pollsters, poll, onDone }: PollFormProps) {
  const save = useSavePoll();
  const resolver = useMemo(
    () =>
      schemaResolver<PollFormValues, typeof pollInputSchema>(
        pollInputSchema,
        (values) => pollInputOf(values, contest.key),
        (path, values) => {
          if (path[0] === 'shares' && path.length > 1) {
            const index = values.shares.findIndex((row) => row.key === path[1]);
            return index >= 0 ? `shares.${index}.share` : 'shares';
          }
          return path.map(String).join('.');
        },
      ),
    [contest.key],
  );
  const form = useForm<PollFormValues>({ resolver, defaultValues: defaults(contest, poll) });
  const rows = useFieldArray({ control: form.control, name: 'shares', keyName: 'fieldId' });
  const { errors } = form.formState;
  // The resolver puts an error about the whole list (the sum) on the field array's root.
  const sharesError = errors.shares?.root?.message ?? (errors.shares as { message?: string } | undefined)?.message;

  return (
    <form
      onSubmit={form.handleSubmit((values) =>
        save.mutate(
          { mode: poll ? 'update' : 'create', poll: pollInputSchema.parse(pollInputOf(values, contest.key)) },
          {
            onSuccess: () => {
              if (!poll) form.reset(defaults(contest));
              onDone?.();
            },
          },
        ),
      )}
      noValidate
      className="space-y-5"
    >
      {save.isError && <Alert tone="danger" title="The poll was not saved">{describeError(save.error)}</Alert>}
      {save.isSuccess && !poll && <Alert tone="success">Poll {save.data.key} was added.</Alert>}
      <fieldset className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-ink-900">The poll</legend>
        <Input label="Poll key" disabled={Boolean(poll)} autoComplete="off" error={errors.key?.message} {...form.register('key')} />
        <Select label="Pollster" error={errors.pollsterId?.message} {...form.register('pollsterId')}>
          <option value="">Choose a firm</option>
          {pollsters.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </Select>
        <Input label="Sponsor" autoComplete="off" error={errors.sponsor?.message} {...form.register('sponsor')} />
        <Select label="Sponsor type" error={errors.sponsorType?.message} {...form.register('sponsorType')}>
          <option value="">Not given</option>
          {SPONSOR_TYPES.map((t) => (
            <option key={t} value={t}>
              {SPONSOR_TYPE_LABELS[t]}
            </option>
          ))}
        </Select>
        <Input label="Fieldwork start" type="date" error={errors.fieldworkStart?.message} {...form.register('fieldworkStart')} />
        <Input label="Fieldwork end" type="date" error={errors.fieldworkEnd?.message} {...form.register('fieldworkEnd')} />
        <Input label="Published on" type="date" error={errors.publishedOn?.message} {...form.register('publishedOn')} />
        <Input label="Sample size" inputMode="numeric" error={errors.sampleSize?.message} {...form.register('sampleSize')} />
        <Select label="Population" error={errors.population?.message} {...form.register('population')}>
          {POPULATIONS.map((p) => (
            <option key={p} value={p}>
              {POPULATION_LABELS[p]}
            </option>
          ))}
        </Select>
        <Select label="Mode" error={errors.mode?.message} {...form.register('mode')}>
          {MODES.map((m) => (
            <option key={m} value={m}>
              {m}
            </option>
          ))}
        </Select>
        <Input
          label="Stated margin of error (points)"
          inputMode="decimal"
          hint="The 95% margin the poll published; leave empty when it stated none."
          error={errors.moe?.message}
          {...form.register('moe')}
        />
        <Input label="Study key" hint="Groups versions of one study." autoComplete="off" error={errors.studyKey?.message} {...form.register('studyKey')} />
        <Input label="Source URL" type="url" error={errors.sourceUrl?.message} {...form.register('sourceUrl')} />
        <Input label="Full tables URL" type="url" error={errors.tablesUrl?.message} {...form.register('tablesUrl')} />
      </fieldset>
      <fieldset className="flex flex-wrap gap-x-6 gap-y-2">
        <legend className="mb-2 text-sm font-semibold text-ink-900">Flags and disclosure</legend>
        {(
          [
            ['isHeadline', 'Headline version of its study'],
            ['tracking', 'Tracking wave'],
            ['questionWording', 'Question wording published'],
            ['weightingStatement', 'Weighting statement published'],
          ] as const
        ).map(([name, label]) => (
          <label key={name} className="inline-flex items-center gap-2 text-sm text-ink-800">
            <input type="checkbox" className="size-4 accent-accent-700" {...form.register(name)} />
            {label}
          </label>
        ))}
      </fieldset>
      <fieldset className="space-y-3">
        <legend className="text-sm font-semibold text-ink-900">Shares (points, 0–100; leave empty when not published)</legend>
        {sharesError && (
          <p role="alert" className="text-sm font-medium text-danger-700">
            <span aria-hidden="true">✕ </span>Shares: {sharesError}
          </p>
        )}
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          {rows.fields.map((row, index) => (
            <Input
              key={row.fieldId}
              label={`Share for ${row.label}`}
              inputMode="decimal"
              autoComplete="off"
              error={errors.shares?.[index]?.share?.message}
              {...form.register(`shares.${index}.share`)}
            />
          ))}
        </div>
      </fieldset>
      <div className="flex gap-2">
        <Button type="submit" busy={save.isPending} busyText="Saving…">
          {poll ? 'Save poll' : 'Add poll'}
        </Button>
        {onDone && poll && (
          <Button variant="ghost" onClick={onDone}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
