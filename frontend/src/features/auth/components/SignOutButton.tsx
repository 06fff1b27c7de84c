import { Button } from '../../../components/ui';
import { useLogout } from '../api/logout';

export function SignOutButton({ onSignedOut }: { onSignedOut: () => void }) {
  const logout = useLogout();
  return (
    <Button
      variant="ghost"
      size="sm"
      busy={logout.isPending}
      busyText="Signing out…"
      onClick={() => logout.mutate(undefined, { onSuccess: onSignedOut })}
    >
      Sign out
    </Button>
  );
}
