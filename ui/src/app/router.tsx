import { useMemo, type ComponentType } from 'react';
import { Navigate, RouterProvider, createBrowserRouter, type LoaderFunction, type RouteObject } from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import { Spinner } from '@fluentui/react-components';
import { paths } from '@/config/paths';
import { RequireSession } from '@/lib/auth';
import { queryClient as defaultQueryClient } from '@/lib/query-client';
import { getSessionToken } from '@/lib/session-token';
import { AppShell } from '@/components/layouts/app-shell';
import { RouteError } from '@/components/errors/route-error';
import { LinkLifecycleDialogHost } from '@/features/links/components/link-lifecycle-dialog';

const sessionFallback = (
  <div style={{ display: 'grid', placeItems: 'center', minHeight: '60vh' }}>
    <Spinner label="Checking your session…" />
  </div>
);

/**
 * A lazy page whose module may export `createLoader(queryClient)`: its loader parses the route's
 * params with the contract schemas and starts the page's queries with the page's own queryOptions.
 * Loaders run before <RequireSession> renders: without a session they do nothing, and the guard
 * sends the visitor to sign in before anything is asked of the api.
 */
function lazyPage(load: () => Promise<{ Component: ComponentType; createLoader?: (queryClient: QueryClient) => LoaderFunction }>, queryClient: QueryClient) {
  return async () => {
    const page = await load();
    if (!page.createLoader) return { Component: page.Component };
    const loader = page.createLoader(queryClient);
    return { Component: page.Component, loader: ((args) => (getSessionToken() ? loader(args) : null)) satisfies LoaderFunction };
  };
}

/** The route table, shared by the browser router and by tests (with a memory router and their own cache). */
export function createRoutes(queryClient: QueryClient = defaultQueryClient): RouteObject[] {
  return [
    {
      path: paths.signIn.path,
      lazy: () => import('@/app/routes/sign-in'),
      errorElement: <RouteError />,
      HydrateFallback: () => null,
    },
    {
      path: paths.app.root.path,
      element: (
        <RequireSession fallback={sessionFallback}>
          <LinkLifecycleDialogHost>
            <AppShell />
          </LinkLifecycleDialogHost>
        </RequireSession>
      ),
      errorElement: <RouteError />,
      HydrateFallback: () => null,
      children: [
        { index: true, element: <Navigate to={paths.app.links.getHref()} replace /> },
        { path: paths.app.links.path, lazy: lazyPage(() => import('@/app/routes/links/links-list'), queryClient), errorElement: <RouteError /> },
        { path: paths.app.newLink.path, lazy: lazyPage(() => import('@/app/routes/links/new-link'), queryClient), errorElement: <RouteError /> },
        { path: paths.app.link.path, lazy: lazyPage(() => import('@/app/routes/links/link-workspace'), queryClient), errorElement: <RouteError /> },
        { path: paths.app.linkHistory.path, lazy: lazyPage(() => import('@/app/routes/links/link-history'), queryClient), errorElement: <RouteError /> },
        { path: paths.app.sites.path, lazy: lazyPage(() => import('@/app/routes/sites/sites-list'), queryClient), errorElement: <RouteError /> },
        { path: paths.app.newSite.path, lazy: lazyPage(() => import('@/app/routes/sites/site-editor'), queryClient), errorElement: <RouteError /> },
        { path: paths.app.site.path, lazy: lazyPage(() => import('@/app/routes/sites/site-editor'), queryClient), errorElement: <RouteError /> },
        { path: paths.app.settings.path, lazy: lazyPage(() => import('@/app/routes/settings/organisation-settings'), queryClient), errorElement: <RouteError /> },
        { path: paths.app.linkAvailability.path, lazy: lazyPage(() => import('@/app/routes/links/link-availability'), queryClient), errorElement: <RouteError /> },
        { path: paths.app.weatherDatasets.path, lazy: lazyPage(() => import('@/app/routes/weather/weather-datasets'), queryClient), errorElement: <RouteError /> },
        { path: '*', lazy: () => import('@/app/routes/not-found') },
      ],
    },
  ];
}

export function AppRouter() {
  const router = useMemo(() => createBrowserRouter(createRoutes()), []);
  return <RouterProvider router={router} />;
}
