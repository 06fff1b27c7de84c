import { useState } from 'react';
import { RouterProvider } from 'react-router-dom';
import { meQueryOptions } from '../features/auth';
import { paths, safeNextPath } from '../lib/paths';
import { AppProviders } from './providers';
import { createAppQueryClient } from './query-client';
import { createAppRouter } from './router';

function createApp() {
  let router: ReturnType<typeof createAppRouter> | undefined;
  const queryClient = createAppQueryClient({
    onUnauthorized: () => {
      queryClient.setQueryData(meQueryOptions().queryKey, null);
      if (!router) return;
      const { pathname, search } = router.state.location;
      if (pathname === paths.signIn.path) return;
      void router.navigate(paths.signIn.href({ next: safeNextPath(`${pathname}${search}`), notice: 'session-expired' }), {
        replace: true,
      });
    },
  });
  router = createAppRouter(queryClient);
  return { queryClient, router };
}

export function App() {
  const [{ queryClient, router }] = useState(createApp);
  return (
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>
  );
}
