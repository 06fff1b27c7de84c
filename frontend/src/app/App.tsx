import { useState } from 'react';
import { RouterProvider } from 'react-router-dom';
import { meQueryOptions } from '../features/auth';
import { paths, safeNextPath } from '../lib/paths';
import { AppProviders } from './providers';
import { createAppQueryClient } from './query-client';
import { createAppRouter } from './router';

function createApp() {
  const holder: { router?: ReturnType<typeof createAppRouter> } = {};
  const queryClient = createAppQueryClient({
    onUnauthorized: () => {
      queryClient.setQueryData(meQueryOptions().queryKey, null);
      const router = holder.router;
      if (!router) return;
      const { pathname, search } = router.state.location;
      if (pathname === paths.signIn.path) return;
      void router.navigate(paths.signIn.href({ next: safeNextPath(`${pathname}${search}`), notice: 'session-expired' }), {
        replace: true,
      });
    },
  });
  const router = createAppRouter(queryClient);
  holder.router = router;
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
