import type { QueryClient } from '@tanstack/react-query';
import { useState, type ComponentType } from 'react';
import { createBrowserRouter, RouterProvider, type LoaderFunction, type RouteObject } from 'react-router-dom';
import { Spinner } from '../components/spinner';
import { paths } from '../config/paths';
import { RouteErrorPage, RouteErrorPanel } from './routes/route-error';

/** What every module under app/routes/ exports: the page, and optionally a loader built on the cache. */
export interface RouteModule {
  default: ComponentType;
  clientLoader?: (queryClient: QueryClient) => LoaderFunction;
}

function lazyRoute(queryClient: QueryClient, load: () => Promise<RouteModule>) {
  return async () => {
    const module = await load();
    return {
      Component: module.default,
      ...(module.clientLoader ? { loader: module.clientLoader(queryClient) } : {}),
    };
  };
}

function FullPageSpinner() {
  return (
    <div className="flex min-h-screen items-center justify-center">
      <Spinner label="Starting Pulsekeeper…" />
    </div>
  );
}

/** The route tree; signed-in pages sit under the app shell, whose loader requires a session. */
export function createAppRoutes(queryClient: QueryClient): RouteObject[] {
  const page = (load: () => Promise<RouteModule>) => ({ lazy: lazyRoute(queryClient, load), errorElement: <RouteErrorPanel /> });
  return [
    {
      id: 'root',
      errorElement: <RouteErrorPage />,
      hydrateFallbackElement: <FullPageSpinner />,
      children: [
        { path: paths.signIn.path, lazy: lazyRoute(queryClient, () => import('./routes/sign-in')) },
        { path: paths.resetPassword.path, lazy: lazyRoute(queryClient, () => import('./routes/reset-password')) },
        { path: paths.resetPasswordComplete.path, lazy: lazyRoute(queryClient, () => import('./routes/reset-password-complete')) },
        { path: paths.acceptInvitation.path, lazy: lazyRoute(queryClient, () => import('./routes/accept-invitation')) },
        {
          path: paths.dashboard.path,
          lazy: lazyRoute(queryClient, () => import('./routes/app-layout')),
          children: [
            { index: true, ...page(() => import('./routes/dashboard')) },
            { path: paths.pulsars.path, ...page(() => import('./routes/pulsars')) },
            { path: paths.pulsar.path, ...page(() => import('./routes/pulsar')) },
            { path: paths.fitRun.path, ...page(() => import('./routes/fit-run')) },
            { path: paths.searchRun.path, ...page(() => import('./routes/search-run')) },
            { path: paths.residualExplorer.path, ...page(() => import('./routes/residual-explorer')) },
            { path: paths.pulsarUpload.path, ...page(() => import('./routes/upload')) },
            { path: paths.pulsarModel.path, ...page(() => import('./routes/model-editor')) },
            { path: paths.pulsarAuditLog.path, ...page(() => import('./routes/audit-log')) },
            { path: paths.fitComparison.path, ...page(() => import('./routes/fit-comparison')) },
            { path: paths.savedComparison.path, ...page(() => import('./routes/comparison')) },
            { path: paths.campaigns.path, ...page(() => import('./routes/campaigns')) },
            { path: paths.campaign.path, ...page(() => import('./routes/campaign')) },
            { path: paths.observatories.path, ...page(() => import('./routes/observatories')) },
            { path: paths.users.path, ...page(() => import('./routes/users')) },
            { path: paths.outbox.path, ...page(() => import('./routes/outbox')) },
            { path: '*', ...page(() => import('./routes/not-found')) },
          ],
        },
      ],
    },
  ];
}

export function AppRouter({ queryClient }: { queryClient: QueryClient }) {
  const [router] = useState(() => createBrowserRouter(createAppRoutes(queryClient)));
  return <RouterProvider router={router} />;
}
