import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { LoadingState } from '../components/ui';
import { apiTokensQueryOptions } from '../features/api-tokens';
import { RequireRole } from '../features/auth';
import { invitationsQueryOptions } from '../features/invitations';
import { mailMessageIdSchema, mailMessageQueryOptions, mailMessagesQueryOptions } from '../features/mailbox';
import { usersQueryOptions } from '../features/users';
import { paths } from '../lib/paths';
import { AppShell } from './layout/AppShell';
import { PublicLayout } from './layout/PublicLayout';
import { RootLayout } from './layout/RootLayout';
import { prefetchLoader, requireUserLoader, signInLoader } from './loaders';
import { AdminMailboxRoute, AdminMailMessageRoute } from './routes/admin-mailbox';
import { AdminUsersRoute } from './routes/admin-users';
import { ApiTokensRoute } from './routes/api-tokens';
import { electionsRoutes } from './routes/areas/elections';
import { pollstersRoutes } from './routes/areas/pollsters';
import { auditsRoutes } from './routes/areas/audits';
import { sharedErrorRoutes } from './routes/areas/shared-error';
import { importsRoutes } from './routes/areas/imports';
import { notesRoutes } from './routes/areas/notes';
import { dataQualityRoutes } from './routes/areas/data-quality';
import { rankingsRoutes } from './routes/areas/rankings';
import { firmAccuracyRoutes } from './routes/areas/firm-accuracy';
import { HomeRoute, homeLoader } from './routes/home';
import { InvitationRoute, invitationLoader } from './routes/invitation';
import { MethodsRoute } from './routes/methods';
import { NotFoundRoute } from './routes/not-found';
import { PublicNoteRoute, publicNoteLoader } from './routes/public-note';
import { ResetPasswordConfirmRoute, ResetPasswordRequestRoute } from './routes/reset-password';
import { RouteErrorBoundary } from './routes/route-error';
import { SignInRoute } from './routes/sign-in';

export function createAppRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      id: 'root',
      element: <RootLayout />,
      errorElement: <RouteErrorBoundary fullPage />,
      hydrateFallbackElement: (
        <div className="flex min-h-screen items-center justify-center">
          <LoadingState label="Loading Veracast…" />
        </div>
      ),
      children: [
        {
          element: <PublicLayout />,
          children: [
            { path: paths.signIn.path, loader: signInLoader(queryClient), element: <SignInRoute /> },
            { path: paths.resetPasswordRequest.path, element: <ResetPasswordRequestRoute /> },
            { path: paths.resetPasswordConfirm.path, element: <ResetPasswordConfirmRoute /> },
            { path: paths.invitation.path, loader: invitationLoader(queryClient), element: <InvitationRoute /> },
            { path: paths.publicNote.path, loader: publicNoteLoader(queryClient), element: <PublicNoteRoute /> },
          ],
        },
        {
          id: 'shell',
          loader: requireUserLoader(queryClient),
          element: <AppShell />,
          children: [
            {
              errorElement: <RouteErrorBoundary />,
              children: [
                { index: true, loader: homeLoader(queryClient), element: <HomeRoute /> },
                ...electionsRoutes(queryClient),
                ...pollstersRoutes(queryClient),
                ...auditsRoutes(queryClient),
                ...sharedErrorRoutes(queryClient),
                ...importsRoutes(queryClient),
                ...notesRoutes(queryClient),
                ...dataQualityRoutes(queryClient),
                ...rankingsRoutes(queryClient),
                ...firmAccuracyRoutes(queryClient),
                { path: paths.methods.path, element: <MethodsRoute /> },
                {
                  path: paths.apiTokens.path,
                  loader: prefetchLoader(queryClient, 'viewer', () => [apiTokensQueryOptions()]),
                  element: <ApiTokensRoute />,
                },
                {
                  element: <RequireRole minimum="admin" />,
                  children: [
                    {
                      path: paths.adminUsers.path,
                      loader: prefetchLoader(queryClient, 'admin', () => [usersQueryOptions(), invitationsQueryOptions()]),
                      element: <AdminUsersRoute />,
                    },
                    {
                      path: paths.adminMailbox.path,
                      loader: prefetchLoader(queryClient, 'admin', () => [mailMessagesQueryOptions()]),
                      element: <AdminMailboxRoute />,
                    },
                    {
                      path: paths.adminMailMessage.path,
                      loader: (args) => {
                        const id = mailMessageIdSchema.safeParse(args.params.messageId);
                        return prefetchLoader(queryClient, 'admin', () =>
                          id.success ? [mailMessageQueryOptions(id.data)] : [],
                        )();
                      },
                      element: <AdminMailMessageRoute />,
                    },
                  ],
                },
                { path: '*', element: <NotFoundRoute /> },
              ],
            },
          ],
        },
      ],
    },
  ];
}

export function createAppRouter(queryClient: QueryClient) {
  return createBrowserRouter(createAppRoutes(queryClient));
}
