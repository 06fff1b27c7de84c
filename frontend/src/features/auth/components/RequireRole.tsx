import { roleAtLeast, type Role } from '@veracast/shared-types';
import type { ReactNode } from 'react';
import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { AccessDenied, LoadingState } from '../../../components/ui';
import { paths } from '../../../lib/paths';
import { useCurrentUser } from '../api/get-me';

export interface RequireRoleProps {
  /** The least powerful role that may see the children. */
  minimum: Role;
  /** Rendered for a signed-in user whose role is too weak; a 403 panel by default. */
  fallback?: ReactNode;
  /** Defaults to the child routes (`<Outlet />`). */
  children?: ReactNode;
}

/**
 * Renders its children only for a user whose role is at least `minimum`. Others see the fallback
 * (never the screen), and signed-out visitors are sent to sign in.
 */
export function RequireRole({ minimum, fallback, children }: RequireRoleProps) {
  const { data: user, isPending, isError } = useCurrentUser();
  const location = useLocation();

  if (isPending) return <LoadingState label="Checking your access…" />;
  if (isError || !user) {
    return <Navigate to={paths.signIn.href({ next: `${location.pathname}${location.search}` })} replace />;
  }
  if (!roleAtLeast(user.role, minimum)) return <>{fallback ?? <AccessDenied homeHref={paths.home.href()} />}</>;
  return <>{children ?? <Outlet />}</>;
}
