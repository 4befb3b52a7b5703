import { useMemo, type ComponentType } from 'react';
import { createBrowserRouter, type LoaderFunction, type LoaderFunctionArgs, type RouteObject } from 'react-router';
import { RouterProvider } from 'react-router/dom';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { AppLayout } from '../components/layouts/app-layout';
import { RootErrorBoundary, RouteErrorBoundary } from '../components/errors/route-error-boundary';
import { Spinner } from '../components/ui/spinner';
import { loadUser, requireUser, type Access } from '../lib/auth';
import { seedFromPage } from './boot-data';

/**
 * What a file under app/routes/ exports: the page as default, and optionally `clientLoader`,
 * which receives the query client and returns the route's loader (to warm the cache).
 */
export interface RouteModule {
  default: ComponentType;
  clientLoader?: (queryClient: QueryClient) => LoaderFunction;
}

function AppLoading() {
  return (
    <div className="grid min-h-dvh place-items-center">
      <Spinner label="Opening Sporewell…" />
    </div>
  );
}

export function createAppRouter(queryClient: QueryClient) {
  // Access is declared here, beside the path, so every page's guard can be read in one place.
  const page = (load: () => Promise<RouteModule>, access: Access = 'anyone'): Pick<RouteObject, 'lazy' | 'ErrorBoundary'> => ({
    ErrorBoundary: RouteErrorBoundary,
    lazy: async () => {
      const module = await load();
      const pageLoader = module.clientLoader?.(queryClient);
      if (access === 'anyone' && !pageLoader) return { Component: module.default };
      return {
        Component: module.default,
        loader: async (args: LoaderFunctionArgs) => {
          if (access !== 'anyone') await requireUser(queryClient, args.request, access === 'signed-in' ? undefined : access);
          return pageLoader ? pageLoader(args) : null;
        },
      };
    },
  });

  return createBrowserRouter([
    {
      id: 'root',
      Component: AppLayout,
      ErrorBoundary: RootErrorBoundary,
      HydrateFallback: AppLoading,
      // The header depends on who is signed in; knowing before the first paint avoids a flash.
      loader: async () => {
        await loadUser(queryClient);
        return null;
      },
      children: [
        { index: true, ...page(() => import('./routes/landing')) },
        { path: 'sign-in', ...page(() => import('./routes/auth/sign-in')) },
        { path: 'join', ...page(() => import('./routes/auth/join')) },
        { path: 'forgot-password', ...page(() => import('./routes/auth/forgot-password')) },
        { path: 'reset-password', ...page(() => import('./routes/auth/reset-password')) },
        { path: 'verify-email', ...page(() => import('./routes/auth/verify-email')) },
        { path: 'batches', ...page(() => import('./routes/batches/batch-shelf'), 'signed-in') },
        { path: 'batches/new', ...page(() => import('./routes/batches/new-batch'), 'signed-in') },
        { path: 'batches/:id', ...page(() => import('./routes/batches/batch-page'), 'signed-in') },
        { path: 'batches/:id/edit', ...page(() => import('./routes/batches/edit-batch'), 'signed-in') },
        { path: 'batches/:id/label', ...page(() => import('./routes/batches/batch-label'), 'signed-in') },
        { path: 'cases/new', ...page(() => import('./routes/cases/open-case'), 'signed-in') },
        { path: 'cases/:id', ...page(() => import('./routes/cases/case-page'), 'signed-in') },
        { path: 'cases/:id/recovery-report', ...page(() => import('./routes/cases/recovery-report'), 'signed-in') },
        { path: 'rounds', ...page(() => import('./routes/rounds/rounds'), ['mentor', 'steward']) },
        { path: 'library', ...page(() => import('./routes/library/field-library')) },
        { path: 'library/:slug', ...page(() => import('./routes/library/field-note')) },
        { path: 'steward', ...page(() => import('./routes/steward/steward-desk'), ['steward']) },
        { path: 'mentors/:id', ...page(() => import('./routes/mentors/mentor-profile'), 'signed-in') },
        { path: 'apply-to-mentor', ...page(() => import('./routes/mentors/apply'), 'signed-in') },
        { path: '*', ...page(() => import('./routes/not-found')) },
      ],
    },
  ]);
}

export function AppRouter() {
  const queryClient = useQueryClient();
  const router = useMemo(() => {
    seedFromPage(queryClient);
    return createAppRouter(queryClient);
  }, [queryClient]);
  return <RouterProvider router={router} />;
}
