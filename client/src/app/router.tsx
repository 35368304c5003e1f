import { useEffect, useMemo } from 'react';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { RouteErrorFallback } from '../components/error-fallback';
import { PageLoader } from '../components/page-loader';
import { paths } from '../config/paths';
import { setUnauthorizedHandler } from '../lib/api-client';
import { queryKeys } from '../lib/query-keys';
import { AppRoot, requireUserLoader } from './routes/app/root';

/** The route tree. Pages load lazily; the shell and its session check are in the first bundle. */
export function createAppRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.signIn.path,
      hydrateFallbackElement: <PageLoader />,
      errorElement: <RouteErrorFallback />,
      lazy: async () => {
        const { SignInRoute, signInLoader } = await import('./routes/auth/sign-in');
        return { Component: SignInRoute, loader: signInLoader(queryClient) };
      },
    },
    {
      path: paths.resetPassword.path,
      hydrateFallbackElement: <PageLoader />,
      errorElement: <RouteErrorFallback />,
      lazy: async () => {
        const { ResetPasswordRoute } = await import('./routes/auth/reset-password');
        return { Component: ResetPasswordRoute };
      },
    },
    {
      path: paths.projects.path,
      element: <AppRoot />,
      loader: requireUserLoader(queryClient),
      hydrateFallbackElement: <PageLoader />,
      errorElement: <RouteErrorFallback />,
      children: [
        {
          errorElement: <RouteErrorFallback />,
          children: [
            {
              index: true,
              lazy: async () => {
                const { ProjectsRoute, projectsLoader } = await import('./routes/app/projects');
                return { Component: ProjectsRoute, loader: projectsLoader(queryClient) };
              },
            },
            {
              path: paths.inbox.path,
              lazy: async () => {
                const { InboxRoute, inboxLoader } = await import('./routes/app/inbox');
                return { Component: InboxRoute, loader: inboxLoader(queryClient) };
              },
            },
            {
              path: paths.outbox.path,
              lazy: async () => {
                const { OutboxRoute, outboxLoader } = await import('./routes/app/outbox');
                return { Component: OutboxRoute, loader: outboxLoader(queryClient) };
              },
            },
            ...teamRoutes(queryClient),
            {
              path: paths.project.path,
              lazy: async () => {
                const { ProjectDesignsRoute, projectDesignsLoader } = await import('./routes/app/project-designs');
                return { Component: ProjectDesignsRoute, loader: projectDesignsLoader(queryClient) };
              },
            },
            {
              path: paths.design.path,
              lazy: async () => {
                const { WorkbenchRoute, workbenchLoader } = await import('./routes/app/workbench');
                return { Component: WorkbenchRoute, loader: workbenchLoader(queryClient) };
              },
            },
            {
              path: paths.partsShelf.path,
              lazy: async () => {
                const { PartsShelfRoute, partsShelfLoader } = await import('./routes/app/parts-shelf');
                return { Component: PartsShelfRoute, loader: partsShelfLoader(queryClient) };
              },
            },
            {
              path: paths.benchRuns.path,
              lazy: async () => {
                const { BenchRunsRoute, benchRunsLoader } = await import('./routes/app/bench-runs');
                return { Component: BenchRunsRoute, loader: benchRunsLoader(queryClient) };
              },
            },
            {
              path: paths.signOff.path,
              lazy: async () => {
                const { SignOffRoute, signOffLoader } = await import('./routes/app/sign-off');
                return { Component: SignOffRoute, loader: signOffLoader(queryClient) };
              },
            },
            {
              path: paths.compareDesigns.path,
              lazy: async () => {
                const { CompareDesignsRoute, compareDesignsLoader } = await import('./routes/app/compare-designs');
                return { Component: CompareDesignsRoute, loader: compareDesignsLoader(queryClient) };
              },
            },
            {
              path: paths.sizer.path,
              lazy: async () => {
                const { SizerRoute, sizerLoader } = await import('./routes/app/sizer');
                return { Component: SizerRoute, loader: sizerLoader(queryClient) };
              },
            },
          ],
        },
      ],
    },
    {
      path: '*',
      hydrateFallbackElement: <PageLoader />,
      lazy: async () => {
        const { NotFoundRoute } = await import('./routes/not-found');
        return { Component: NotFoundRoute };
      },
    },
  ];
}

/** Administration, project members and settings, and the user's mail settings. */
function teamRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      path: paths.accounts.path,
      lazy: async () => {
        const { AccountsRoute, accountsLoader } = await import('./routes/app/accounts');
        return { Component: AccountsRoute, loader: accountsLoader(queryClient) };
      },
    },
    {
      path: paths.auditLog.path,
      lazy: async () => {
        const { AuditLogRoute, auditLogLoader } = await import('./routes/app/audit-log');
        return { Component: AuditLogRoute, loader: auditLogLoader(queryClient) };
      },
    },
    {
      path: paths.notificationSettings.path,
      lazy: async () => {
        const { NotificationSettingsRoute, notificationSettingsLoader } =
          await import('./routes/app/notification-settings');
        return { Component: NotificationSettingsRoute, loader: notificationSettingsLoader(queryClient) };
      },
    },
    {
      path: paths.projectMembers.path,
      lazy: async () => {
        const { ProjectMembersRoute, projectMembersLoader } = await import('./routes/app/project-members');
        return { Component: ProjectMembersRoute, loader: projectMembersLoader(queryClient) };
      },
    },
    {
      path: paths.projectSettings.path,
      lazy: async () => {
        const { ProjectSettingsRoute, projectSettingsLoader } = await import('./routes/app/project-settings');
        return { Component: ProjectSettingsRoute, loader: projectSettingsLoader(queryClient) };
      },
    },
  ];
}

export function AppRouter() {
  const queryClient = useQueryClient();
  const router = useMemo(() => createBrowserRouter(createAppRoutes(queryClient)), [queryClient]);

  useEffect(() => {
    setUnauthorizedHandler(() => {
      queryClient.setQueryData(queryKeys.auth.me(), null);
      const { pathname, search } = router.state.location;
      void router.navigate(paths.signIn.getHref(pathname + search), { replace: true });
    });
    return () => setUnauthorizedHandler(null);
  }, [queryClient, router]);

  return <RouterProvider router={router} />;
}
