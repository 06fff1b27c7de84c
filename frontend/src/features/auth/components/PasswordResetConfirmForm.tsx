import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { Alert, Button, Input } from '../../../components/ui';
import { describeError, isApiError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { useConfirmPasswordReset } from '../api/confirm-password-reset';
import { newPasswordFieldsSchema, PASSWORD_HINT } from '../../../utils/password';

function isDeadToken(error: unknown) {
  return isApiError(error) && (error.status === 400 || error.status === 404 || error.status === 410);
}

export function PasswordResetConfirmForm({ token, onDone }: { token: string; onDone: () => void }) {
  const confirm = useConfirmPasswordReset();
  const form = useForm({
    resolver: zodResolver(newPasswordFieldsSchema),
    defaultValues: { password: '', confirmPassword: '' },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(({ password }) => {
    confirm.mutate({ token, password }, { onSuccess: onDone });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {confirm.isError &&
        (isDeadToken(confirm.error) ? (
          <Alert tone="danger" title="This reset link no longer works">
            It may have been used already or have expired.{' '}
            <Link to={paths.resetPasswordRequest.href()}>Ask for a new link</Link>.
          </Alert>
        ) : (
          <Alert tone="danger">{describeError(confirm.error)}</Alert>
        ))}
      <Input
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={PASSWORD_HINT}
        error={errors.password?.message}
        {...form.register('password')}
      />
      <Input
        label="New password again"
        type="password"
        autoComplete="new-password"
        error={errors.confirmPassword?.message}
        {...form.register('confirmPassword')}
      />
      <Button type="submit" busy={confirm.isPending} busyText="Saving…">
        Set new password
      </Button>
    </form>
  );
}
