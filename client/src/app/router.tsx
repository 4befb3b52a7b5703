import { useMemo, type ComponentType } from 'react';
import { createBrowserRouter, type LoaderFunction, type LoaderFunctionArgs, type RouteObject } from 'react-router';
import { RouterProvider } from 'react-router/dom';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { AppLayout } from '../components/layouts/app-layout';
import { RootErrorBoundary, RouteErrorBoundary } from '../components/errors/route-error-boundary';
import { Spinner } from '../components/ui/spinner';
import { loadUser, requireUser, type Access } from '../lib/auth';
import { seedFromPage } from './boot-data';
import { openCaseLoader } from './routes/cases/open-case.loader';
import { caseLoader } from './routes/cases/case-page.loader';
import { fieldLibraryLoader } from './routes/library/field-library.loader';

/** Receives the query client and returns a route's loader (to warm the cache). */
export type ClientLoader = (queryClient: QueryClient) => LoaderFunction;

/**
 * What a file under app/routes/ exports: the page as default, and optionally `clientLoader`.
 * A page whose data should be asked for while its code is still on the way keeps its loader in a
 * `<page>.loader.ts` beside it instead, passed to `page()` here: that file is small and part of
 * the app's entry, so the loader starts at once and runs alongside the page's chunk.
 */
export interface RouteModule {
  default: ComponentType;
  clientLoader?: ClientLoader;
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
  const page = (load: () => Promise<RouteModule>, access: Access = 'anyone', early?: ClientLoader): Pick<RouteObject, 'lazy' | 'ErrorBoundary' | 'loader'> => {
    const guarded = (pageLoader: LoaderFunction | undefined) => async (args: LoaderFunctionArgs) => {
      if (access !== 'anyone') await requireUser(queryClient, args.request, access === 'signed-in' ? undefined : access);
      return pageLoader ? pageLoader(args) : null;
    };
    // Defined on the route itself, React Router runs the loader while `lazy` fetches the chunk.
    if (early) return { ErrorBoundary: RouteErrorBoundary, loader: guarded(early(queryClient)), lazy: async () => ({ Component: (await load()).default }) };
    return {
      ErrorBoundary: RouteErrorBoundary,
      lazy: async () => {
        const module = await load();
        const pageLoader = module.clientLoader?.(queryClient);
        if (access === 'anyone' && !pageLoader) return { Component: module.default };
        return { Component: module.default, loader: guarded(pageLoader) };
      },
    };
  };

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
        { path: 'cases/new', ...page(() => import('./routes/cases/open-case'), 'signed-in', openCaseLoader) },
        { path: 'cases/:id', ...page(() => import('./routes/cases/case-page'), 'signed-in', caseLoader) },
        { path: 'cases/:id/recovery-report', ...page(() => import('./routes/cases/recovery-report'), 'signed-in') },
        { path: 'rounds', ...page(() => import('./routes/rounds/rounds'), ['mentor', 'steward']) },
        { path: 'library', ...page(() => import('./routes/library/field-library'), 'anyone', fieldLibraryLoader) },
        { path: 'library/:slug', ...page(() => import('./routes/library/field-note')) },
        { path: 'steward', ...page(() => import('./routes/steward/steward-desk'), ['steward']) },
        { path: 'mentors/:id', ...page(() => import('./routes/mentors/mentor-profile'), 'signed-in') },
        { path: 'apply-to-mentor', ...page(() => import('./routes/mentors/apply'), 'signed-in') },
        { path: 'account', ...page(() => import('./routes/account/account'), 'signed-in') },
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
