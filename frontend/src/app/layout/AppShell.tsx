import { useQueryClient } from '@tanstack/react-query';
import { roleAtLeast, type Role, type User } from '@veracast/shared-types';
import { Link, NavLink, Outlet, useNavigate } from 'react-router-dom';
import { LoadingState } from '../../components/ui';
import { SignOutButton, meQueryOptions, useCurrentUser } from '../../features/auth';
import { cn } from '../../lib/cn';
import { paths } from '../../lib/paths';
import { ROLE_LABELS } from '../../utils/roles';
import { NAVIGATION } from './navigation';

function allowed(user: User, minimum: Role | undefined) {
  return minimum === undefined || roleAtLeast(user.role, minimum);
}

export function MainNavigation({ user }: { user: User }) {
  return (
    <nav aria-label="Main" className="space-y-6">
      {NAVIGATION.filter((group) => allowed(user, group.minimum)).map((group) => (
        <div key={group.label}>
          <h2 className="px-3 text-xs font-semibold tracking-wide text-ink-500 uppercase">{group.label}</h2>
          <ul className="mt-2 space-y-0.5">
            {group.items
              .filter((item) => allowed(user, item.minimum))
              .map((item) => (
                <li key={item.href}>
                  <NavLink
                    to={item.href}
                    end={item.end}
                    className={({ isActive }) =>
                      cn(
                        'block rounded-md border-l-4 px-3 py-1.5 text-sm font-medium',
                        isActive
                          ? 'border-accent-700 bg-accent-50 text-accent-900'
                          : 'border-transparent text-ink-700 hover:bg-ink-100 hover:text-ink-950',
                      )
                    }
                  >
                    {item.label}
                  </NavLink>
                </li>
              ))}
          </ul>
        </div>
      ))}
    </nav>
  );
}

export function AppShell() {
  const { data: user } = useCurrentUser();
  const navigate = useNavigate();
  const queryClient = useQueryClient();

  async function afterSignOut() {
    await navigate(paths.signIn.href({ notice: 'signed-out' }), { replace: true });
    // Nothing the previous user could see stays in memory.
    queryClient.clear();
    queryClient.setQueryData(meQueryOptions().queryKey, null);
  }

  return (
    <div className="min-h-screen">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-10 focus:rounded-md focus:bg-white focus:px-3 focus:py-2"
      >
        Skip to content
      </a>
      <header className="border-b border-ink-200 bg-white">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center justify-between gap-3 px-4 py-3 sm:px-6">
          <Link to={paths.home.href()} className="text-xl font-semibold tracking-tight text-accent-800">
            Veracast
          </Link>
          {user && (
            <div className="flex items-center gap-3 text-sm">
              <span className="text-ink-900">
                <span className="sr-only">Signed in as </span>
                <span className="font-medium">{user.name}</span>
              </span>
              <span className="rounded-full border border-ink-300 px-2 py-0.5 text-xs font-medium text-ink-700">
                <span className="sr-only">Role: </span>
                {ROLE_LABELS[user.role]}
              </span>
              <SignOutButton onSignedOut={() => void afterSignOut()} />
            </div>
          )}
        </div>
      </header>
      <div className="mx-auto flex max-w-7xl flex-col gap-6 px-4 py-6 sm:px-6 md:flex-row md:gap-10">
        <aside className="md:w-56 md:shrink-0">{user && <MainNavigation user={user} />}</aside>
        <main id="main" tabIndex={-1} className="min-w-0 flex-1 focus:outline-none">
          {user ? <Outlet /> : <LoadingState />}
        </main>
      </div>
    </div>
  );
}
