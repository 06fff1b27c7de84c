import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Alert, Button, Input } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { passwordResetRequestInputSchema, useRequestPasswordReset } from '../api/request-password-reset';

export function PasswordResetRequestForm() {
  const request = useRequestPasswordReset();
  const form = useForm({
    resolver: zodResolver(passwordResetRequestInputSchema),
    defaultValues: { email: '' },
  });
  const { errors } = form.formState;

  if (request.isSuccess) {
    return (
      <Alert tone="success" title="Check your e-mail">
        If an account uses that address, a message with a link to choose a new password is on its way. The link
        works once and expires after a while.
      </Alert>
    );
  }

  return (
    <form onSubmit={form.handleSubmit((values) => request.mutate(values))} noValidate className="space-y-4">
      {request.isError && <Alert tone="danger">{describeError(request.error)}</Alert>}
      <Input
        label="E-mail address"
        type="email"
        autoComplete="email"
        error={errors.email?.message}
        {...form.register('email')}
      />
      <Button type="submit" busy={request.isPending} busyText="Sending…">
        Send reset link
      </Button>
    </form>
  );
}
