import type { FetchQueryOptions, QueryClient } from '@tanstack/react-query';
import { roleAtLeast, type Role, type User } from '@veracast/shared-types';
import { redirect, type LoaderFunctionArgs } from 'react-router-dom';
import { meQueryOptions } from '../features/auth';
import { paths, safeNextPath } from '../lib/paths';

export function ensureUser(queryClient: QueryClient): Promise<User | null> {
  return queryClient.ensureQueryData(meQueryOptions());
}

/** The app shell's loader: signed-out visitors go to sign-in and come back afterwards. */
export function requireUserLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    const user = await ensureUser(queryClient);
    if (!user) {
      const url = new URL(request.url);
      throw redirect(paths.signIn.href({ next: safeNextPath(`${url.pathname}${url.search}`) }));
    }
    return null;
  };
}

/** The sign-in page's loader: someone already signed in goes straight on. */
export function signInLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    const user = await ensureUser(queryClient).catch(() => null);
    if (user) throw redirect(safeNextPath(new URL(request.url).searchParams.get('next')));
    return null;
  };
}

// Each query option factory returns its own precise type; the loader only needs them as a list.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyFetchOptions = FetchQueryOptions<any, any, any, any>;

/**
 * Starts loading a screen's data with the navigation, but only for a user whose role may see it:
 * loaders run beside the shell's, so each checks the role itself. Never throws for the data; the
 * screen shows its own loading and error states, and `RequireRole` shows the 403 panel.
 */
export function prefetchLoader(queryClient: QueryClient, minimum: Role, options: () => AnyFetchOptions[]) {
  return async () => {
    const user = await ensureUser(queryClient).catch(() => null);
    if (user && roleAtLeast(user.role, minimum)) {
      await Promise.all(options().map((option) => queryClient.prefetchQuery(option)));
    }
    return null;
  };
}
