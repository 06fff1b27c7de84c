import { zodResolver } from '@hookform/resolvers/zod';
import { passwordSchema, type User } from '@veracast/shared-types';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Alert, Button, Input, LoadingState } from '../../../components/ui';
import { describeError, isApiError } from '../../../lib/api-client';
import { formatDateTime } from '../../../utils/format';
import { PASSWORD_HINT, PASSWORD_MISMATCH, passwordsMatch } from '../../../utils/password';
import { ROLE_LABELS, ROLE_SUMMARIES } from '../../../utils/roles';
import { acceptInvitationInputSchema, useAcceptInvitation } from '../api/accept-invitation';
import { useInvitationPreview } from '../api/get-invitation-preview';

const acceptFormSchema = z
  .object({
    name: acceptInvitationInputSchema.shape.name,
    password: passwordSchema,
    confirmPassword: z.string(),
  })
  .refine(passwordsMatch, PASSWORD_MISMATCH);

function DeadInvitation({ error }: { error: unknown }) {
  if (isApiError(error) && (error.status === 404 || error.status === 410)) {
    return (
      <Alert tone="danger" title="This invitation cannot be used">
        It is unknown, has been used already, or has expired. Ask the person who invited you to send a new one.
      </Alert>
    );
  }
  return <Alert tone="danger">{describeError(error)}</Alert>;
}

export function AcceptInvitationForm({ token, onAccepted }: { token: string; onAccepted: (user: User) => void }) {
  const preview = useInvitationPreview(token);
  const accept = useAcceptInvitation();
  const form = useForm({
    resolver: zodResolver(acceptFormSchema),
    defaultValues: { name: '', password: '', confirmPassword: '' },
  });
  const { errors } = form.formState;

  if (preview.isPending) return <LoadingState label="Checking the invitation…" />;
  if (preview.isError) return <DeadInvitation error={preview.error} />;

  const invitation = preview.data;
  const onSubmit = form.handleSubmit(({ name, password }) => {
    accept.mutate({ token, name, password }, { onSuccess: onAccepted });
  });

  return (
    <div className="space-y-5">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 rounded-md border border-ink-200 bg-ink-50 px-4 py-3 text-sm">
        <dt className="font-medium text-ink-600">E-mail address</dt>
        <dd className="text-ink-900">{invitation.email}</dd>
        <dt className="font-medium text-ink-600">Role</dt>
        <dd className="text-ink-900">
          {ROLE_LABELS[invitation.role]} <span className="text-ink-600">({ROLE_SUMMARIES[invitation.role]})</span>
        </dd>
        <dt className="font-medium text-ink-600">Expires</dt>
        <dd className="text-ink-900">{formatDateTime(invitation.expiresAt)}</dd>
      </dl>
      <form onSubmit={onSubmit} noValidate className="space-y-4">
        {accept.isError && <DeadInvitation error={accept.error} />}
        <Input label="Your name" autoComplete="name" error={errors.name?.message} {...form.register('name')} />
        <Input
          label="Password"
          type="password"
          autoComplete="new-password"
          hint={PASSWORD_HINT}
          error={errors.password?.message}
          {...form.register('password')}
        />
        <Input
          label="Password again"
          type="password"
          autoComplete="new-password"
          error={errors.confirmPassword?.message}
          {...form.register('confirmPassword')}
        />
        <Button type="submit" busy={accept.isPending} busyText="Creating your account…">
          Create account
        </Button>
      </form>
    </div>
  );
}
