import { zodResolver } from '@hookform/resolvers/zod';
import type { ApiTokenCreated } from '@veracast/shared-types';
import { useForm } from 'react-hook-form';
import { Alert, Button, CopyButton, Input } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { createApiTokenInputSchema, useCreateApiToken } from '../api/create-api-token';

function NewTokenSecret({ created, onDismiss }: { created: ApiTokenCreated; onDismiss: () => void }) {
  return (
    <div className="space-y-3">
      <Alert tone="caution" title="Copy this token now" assertive>
        This is the only time Veracast shows it; only a hash of it is kept. Store it where your scripts can read it,
        and never commit it to a repository.
      </Alert>
      <div className="flex flex-wrap items-end gap-3">
        <Input
          label={`New token “${created.name}”`}
          value={created.token}
          readOnly
          onFocus={(event) => event.currentTarget.select()}
          className="font-mono"
          fieldClassName="min-w-0 flex-1"
          spellCheck={false}
        />
        <CopyButton value={created.token} label="Copy token" />
      </div>
      <p className="text-sm text-ink-600">
        Send it as <code className="font-mono">Authorization: Bearer &lt;token&gt;</code>.
      </p>
      <Button variant="secondary" onClick={onDismiss}>
        I have stored it
      </Button>
    </div>
  );
}

export function CreateApiTokenForm() {
  const create = useCreateApiToken();
  const form = useForm({
    resolver: zodResolver(createApiTokenInputSchema),
    defaultValues: { name: '' },
  });
  const { errors } = form.formState;

  if (create.isSuccess) return <NewTokenSecret created={create.data} onDismiss={() => create.reset()} />;

  return (
    <form
      onSubmit={form.handleSubmit((values) => create.mutate(values, { onSuccess: () => form.reset() }))}
      noValidate
      className="space-y-4"
    >
      {create.isError && <Alert tone="danger">{describeError(create.error)}</Alert>}
      <Input
        label="Token name"
        hint="Say what will use it, e.g. “nightly results import”."
        autoComplete="off"
        error={errors.name?.message}
        {...form.register('name')}
      />
      <Button type="submit" busy={create.isPending} busyText="Creating…">
        Create token
      </Button>
    </form>
  );
}
