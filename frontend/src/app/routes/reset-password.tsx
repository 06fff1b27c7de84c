import { Link, useNavigate, useParams } from 'react-router-dom';
import { PasswordResetConfirmForm, PasswordResetRequestForm } from '../../features/auth';
import { paths } from '../../lib/paths';
import { PublicPanel } from '../layout/PublicLayout';

export function ResetPasswordRequestRoute() {
  return (
    <PublicPanel title="Reset your password">
      <p className="mb-4 text-sm text-ink-600">
        Give the e-mail address of your account and we will send a link to choose a new password.
      </p>
      <PasswordResetRequestForm />
      <p className="mt-6 text-sm">
        <Link to={paths.signIn.href()} className="font-medium text-accent-700 underline">
          Back to sign in
        </Link>
      </p>
    </PublicPanel>
  );
}

export function ResetPasswordConfirmRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  return (
    <PublicPanel title="Choose a new password">
      <PasswordResetConfirmForm
        token={token}
        onDone={() => void navigate(paths.signIn.href({ notice: 'password-reset' }), { replace: true })}
      />
    </PublicPanel>
  );
}
