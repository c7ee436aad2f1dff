import { useMemo, type ComponentType } from 'react';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, type LoaderFunction, type ActionFunction, type RouteObject } from 'react-router';
import { RouterProvider } from 'react-router/dom';
import { setUnauthorizedHandler, signInHref } from '@/lib/api-client';
import { RouteError } from '@/components/errors/route-error';
import { AppSplash } from '@/components/layouts/app-splash';

/**
 * A route module (app/routes/**) exports a default component and, optionally,
 * `clientLoader(queryClient)` / `clientAction(queryClient)` factories so loaders share the app's
 * QueryClient, plus an optional `ErrorBoundary`.
 */
export type RouteModule = {
  default: ComponentType;
  clientLoader?: (queryClient: QueryClient) => LoaderFunction;
  clientAction?: (queryClient: QueryClient) => ActionFunction;
  ErrorBoundary?: ComponentType;
  handle?: unknown;
};

const convert =
  (queryClient: QueryClient) =>
  ({ default: Component, clientLoader, clientAction, ErrorBoundary, handle }: RouteModule) => {
    const route: Partial<Pick<RouteObject, 'Component' | 'loader' | 'action' | 'ErrorBoundary' | 'handle'>> = { Component };
    if (clientLoader) route.loader = clientLoader(queryClient);
    if (clientAction) route.action = clientAction(queryClient);
    if (ErrorBoundary) route.ErrorBoundary = ErrorBoundary;
    if (handle !== undefined) route.handle = handle;
    return route;
  };

export function createRoutes(queryClient: QueryClient): RouteObject[] {
  const load = convert(queryClient);
  return [
    {
      id: 'root',
      errorElement: <RouteError bare />,
      hydrateFallbackElement: <AppSplash />,
      children: [
        // Public pages: no session needed.
        { path: 'sign-in', lazy: () => import('./routes/sign-in').then(load) },
        { path: 'forgot-password', lazy: () => import('./routes/forgot-password').then(load) },
        { path: 'reset-password', lazy: () => import('./routes/reset-password').then(load) },
        { path: 'accept-invitation', lazy: () => import('./routes/accept-invitation').then(load) },

        // The signed-in app: the layout's loader is the session guard.
        {
          id: 'app',
          lazy: () => import('./routes/app/root').then(load),
          children: [
            {
              // Errors inside a page render within the app layout, header and navigation intact.
              errorElement: <RouteError />,
              children: [
                { index: true, lazy: () => import('./routes/app/home').then(load) },
                { path: 'admin/users', lazy: () => import('./routes/app/admin/users').then(load) },
                { path: 'admin/mail', lazy: () => import('./routes/app/admin/mail').then(load) },
                { path: 'library', lazy: () => import('./routes/app/library/list').then(load) },
                { path: 'library/new', lazy: () => import('./routes/app/library/new').then(load) },
                { path: 'library/import', lazy: () => import('./routes/app/library/import').then(load) },
                { path: 'library/:id', lazy: () => import('./routes/app/library/ingredient').then(load) },
                { path: 'species', lazy: () => import('./routes/app/species').then(load) },
                { path: 'bench', lazy: () => import('./routes/app/bench').then(load) },
                { path: 'reactions', lazy: () => import('./routes/app/reactions').then(load) },
                { path: 'briefs', lazy: () => import('./routes/app/briefs/list').then(load) },
                { path: 'briefs/new', lazy: () => import('./routes/app/briefs/new').then(load) },
                { path: 'briefs/:id', lazy: () => import('./routes/app/briefs/brief').then(load) },
                { path: 'runs/:id', lazy: () => import('./routes/app/runs/run').then(load) },
                { path: 'compare', lazy: () => import('./routes/app/compare').then(load) },
                { path: 'candidates/:id', lazy: () => import('./routes/app/candidates/candidate').then(load) },
                { path: 'candidates/:id/dossier', lazy: () => import('./routes/app/candidates/dossier').then(load) },
                { path: 'reviews', lazy: () => import('./routes/app/reviews').then(load) },
                { path: 'lab-logs', lazy: () => import('./routes/app/lab-logs/list').then(load) },
                { path: 'lab-logs/:id', lazy: () => import('./routes/app/lab-logs/log').then(load) },
                { path: '*', lazy: () => import('./routes/not-found').then(load) },
              ],
            },
          ],
        },
      ],
    },
  ];
}

export function createAppRouter(queryClient: QueryClient) {
  const router = createBrowserRouter(createRoutes(queryClient));
  // A 401 from any call but login/me means the session ended: forget it and go to sign-in.
  setUnauthorizedHandler((nextPath) => {
    // The session query's module (and its schema) is loaded lazily: it is not needed to draw the first screen.
    void import('@/features/auth/api/get-me').then(({ authKeys }) => queryClient.setQueryData(authKeys.me(), null));
    if (window.location.pathname !== '/sign-in') void router.navigate(signInHref(nextPath), { replace: true });
  });
  return router;
}

export function AppRouter() {
  const queryClient = useQueryClient();
  const router = useMemo(() => createAppRouter(queryClient), [queryClient]);
  return <RouterProvider router={router} />;
}
