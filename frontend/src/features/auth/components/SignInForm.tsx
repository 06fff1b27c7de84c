import { zodResolver } from '@hookform/resolvers/zod';
import type { User } from '@veracast/shared-types';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { Alert, Button, Input } from '../../../components/ui';
import { describeError, isApiError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { loginInputSchema, useLogin } from '../api/login';

function signInErrorMessage(error: unknown): string {
  if (isApiError(error)) {
    if (error.code === 'invalid_credentials' || error.status === 401) {
      return 'The e-mail address or the password is not right.';
    }
    if (error.status === 429) return 'Too many sign-in attempts. Wait a few minutes, then try again.';
  }
  return describeError(error);
}

export function SignInForm({ onSignedIn }: { onSignedIn: (user: User) => void }) {
  const login = useLogin();
  const form = useForm({
    resolver: zodResolver(loginInputSchema),
    defaultValues: { email: '', password: '' },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit((values) => {
    login.mutate(values, { onSuccess: onSignedIn });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {login.isError && <Alert tone="danger">{signInErrorMessage(login.error)}</Alert>}
      <Input
        label="E-mail address"
        type="email"
        autoComplete="username"
        error={errors.email?.message}
        {...form.register('email')}
      />
      <Input
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...form.register('password')}
      />
      <div className="flex flex-wrap items-center justify-between gap-3 pt-1">
        <Button type="submit" busy={login.isPending} busyText="Signing in…">
          Sign in
        </Button>
        <Link to={paths.resetPasswordRequest.href()} className="text-sm font-medium text-accent-700 underline">
          Forgot your password?
        </Link>
      </div>
    </form>
  );
}
