import { useMemo } from 'react';
import { Navigate, RouterProvider, createBrowserRouter, type RouteObject } from 'react-router-dom';
import { Spinner } from '@fluentui/react-components';
import { paths } from '@/config/paths';
import { RequireSession } from '@/lib/auth';
import { AppShell } from '@/components/layouts/app-shell';
import { RouteError } from '@/components/errors/route-error';
import { LinkLifecycleDialogHost } from '@/features/links/components/link-lifecycle-dialog';

const sessionFallback = (
  <div style={{ display: 'grid', placeItems: 'center', minHeight: '60vh' }}>
    <Spinner label="Checking your session…" />
  </div>
);

/** The route table, shared by the browser router and by tests (with a memory router). */
export function createRoutes(): RouteObject[] {
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
        { path: paths.app.links.path, lazy: () => import('@/app/routes/links/links-list'), errorElement: <RouteError /> },
        { path: paths.app.newLink.path, lazy: () => import('@/app/routes/links/new-link'), errorElement: <RouteError /> },
        { path: paths.app.link.path, lazy: () => import('@/app/routes/links/link-workspace'), errorElement: <RouteError /> },
        { path: paths.app.linkHistory.path, lazy: () => import('@/app/routes/links/link-history'), errorElement: <RouteError /> },
        { path: '*', lazy: () => import('@/app/routes/not-found') },
      ],
    },
  ];
}

export function AppRouter() {
  const router = useMemo(() => createBrowserRouter(createRoutes()), []);
  return <RouterProvider router={router} />;
}
