import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Alert, Button, Input, Select } from '../../../components/ui';
import { describeError, isApiError } from '../../../lib/api-client';
import { ROLE_OPTIONS, ROLE_SUMMARIES } from '../../../utils/roles';
import { createInvitationInputSchema, useCreateInvitation } from '../api/create-invitation';

function inviteErrorMessage(error: unknown): string {
  if (isApiError(error) && error.status === 409) {
    return error.message || 'That address already has an account or a pending invitation.';
  }
  return describeError(error);
}

export function InviteForm() {
  const create = useCreateInvitation();
  const form = useForm({
    resolver: zodResolver(createInvitationInputSchema),
    defaultValues: { email: '', role: 'viewer' as const },
  });
  const { errors } = form.formState;
  const role = form.watch('role');

  const onSubmit = form.handleSubmit((values) => {
    create.mutate(values, { onSuccess: () => form.reset({ email: '', role: values.role }) });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {create.isSuccess && (
        <Alert tone="success">
          Invitation sent to {create.data.email}. The link in the e-mail lets them choose a name and password.
        </Alert>
      )}
      {create.isError && <Alert tone="danger">{inviteErrorMessage(create.error)}</Alert>}
      <div className="grid gap-4 sm:grid-cols-[2fr_1fr]">
        <Input
          label="E-mail address to invite"
          type="email"
          autoComplete="off"
          error={errors.email?.message}
          {...form.register('email')}
        />
        <Select
          label="Role"
          error={errors.role?.message}
          hint={ROLE_SUMMARIES[role] ? `Can: ${ROLE_SUMMARIES[role]}.` : undefined}
          {...form.register('role')}
        >
          {ROLE_OPTIONS.map((option) => (
            <option key={option.value} value={option.value}>
              {option.label}
            </option>
          ))}
        </Select>
      </div>
      <Button type="submit" busy={create.isPending} busyText="Sending…">
        Send invitation
      </Button>
    </form>
  );
}
