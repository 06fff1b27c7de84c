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
      <div className="space-y-1.5">
        <p className="text-sm font-medium text-ink-800" id="new-token-label">
          Token “{created.name}”
        </p>
        <div className="flex flex-wrap items-center gap-3">
          <code
            aria-labelledby="new-token-label"
            className="rounded-md border border-ink-300 bg-ink-100 px-3 py-2 font-mono text-sm break-all text-ink-950 select-all"
          >
            {created.token}
          </code>
          <CopyButton value={created.token} label="Copy token" />
        </div>
        <p className="text-sm text-ink-600">
          Send it as <code className="font-mono">Authorization: Bearer &lt;token&gt;</code>.
        </p>
      </div>
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
