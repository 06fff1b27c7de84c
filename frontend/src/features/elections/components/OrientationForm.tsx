import { zodResolver } from '@hookform/resolvers/zod';
import type { ElectionDto } from '@veracast/shared-types';
import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import { Alert, Button, Select } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { setOrientationInputSchema, useSetOrientation, type SetOrientationInput } from '../api/set-orientation';

export interface OrientationFormProps {
  election: ElectionDto;
  /** The blocs that stand in at least one contest of the election. */
  blocs: string[];
}

/** A reviewer sets which two blocs orient every margin of the election (A first). */
export function OrientationForm({ election, blocs }: OrientationFormProps) {
  const save = useSetOrientation();
  const form = useForm<SetOrientationInput>({
    resolver: zodResolver(setOrientationInputSchema),
    defaultValues: { blocA: election.blocA ?? '', blocB: election.blocB ?? '' },
  });
  const { errors } = form.formState;

  useEffect(() => form.reset({ blocA: election.blocA ?? '', blocB: election.blocB ?? '' }), [election.blocA, election.blocB, form]);

  if (blocs.length < 2) return <p className="text-sm text-ink-600">Fewer than two blocs stand in this election, so there is nothing to set.</p>;

  return (
    <form
      onSubmit={form.handleSubmit((blocs) => save.mutate({ key: election.key, blocs }))}
      noValidate
      className="space-y-4"
    >
      {save.isError && <Alert tone="danger">{describeError(save.error)}</Alert>}
      {save.isSuccess && <Alert tone="success">The orientation was saved and logged.</Alert>}
      <div className="grid gap-4 sm:grid-cols-2">
        <Select label="Bloc A" error={errors.blocA?.message} {...form.register('blocA')}>
          <option value="">Choose a bloc</option>
          {blocs.map((bloc) => (
            <option key={bloc} value={bloc}>
              {bloc}
            </option>
          ))}
        </Select>
        <Select label="Bloc B" error={errors.blocB?.message} {...form.register('blocB')}>
          <option value="">Choose a bloc</option>
          {blocs.map((bloc) => (
            <option key={bloc} value={bloc}>
              {bloc}
            </option>
          ))}
        </Select>
      </div>
      <Button type="submit" busy={save.isPending} busyText="Saving…">
        Set orientation
      </Button>
    </form>
  );
}
