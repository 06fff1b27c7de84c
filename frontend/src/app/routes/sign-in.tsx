import { useNavigate, useSearchParams } from 'react-router-dom';
import { Alert } from '../../components/ui';
import { SignInForm } from '../../features/auth';
import { isSignInNotice, safeNextPath, SIGN_IN_NOTICES } from '../../lib/paths';
import { PublicPanel } from '../layout/PublicLayout';

export function SignInRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const notice = params.get('notice');
  const next = safeNextPath(params.get('next'));

  return (
    <PublicPanel title="Sign in">
      {isSignInNotice(notice) && (
        <Alert tone={notice === 'session-expired' ? 'caution' : 'success'} className="mb-4">
          {SIGN_IN_NOTICES[notice]}
        </Alert>
      )}
      <SignInForm onSignedIn={() => void navigate(next, { replace: true })} />
      <p className="mt-6 text-sm text-ink-600">
        Accounts are created by invitation. Ask an administrator of your team for one.
      </p>
    </PublicPanel>
  );
}
