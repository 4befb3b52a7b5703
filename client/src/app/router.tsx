import { useMemo, type ComponentType } from 'react';
import { createBrowserRouter, type LoaderFunction, type LoaderFunctionArgs, type RouteObject } from 'react-router';
import { RouterProvider } from 'react-router/dom';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { AppLayout } from '../components/layouts/app-layout';
import { RootErrorBoundary, RouteErrorBoundary } from '../components/errors/route-error-boundary';
import { Spinner } from '../components/ui/spinner';
import { PAGES, type Access } from '@shared/pages';
import { loadUser, requireUser } from '../lib/auth';
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

// Each page is its own chunk, fetched when its address is first opened (the server names the
// chunk in the HTML of a deep link, so the browser fetches it alongside the app's).
const pageModules = import.meta.glob<RouteModule>('./routes/**/*.tsx');

export function createAppRouter(queryClient: QueryClient) {
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
      // Paths and who may open them are listed in server/shared/pages.ts, in one place.
      children: PAGES.map(({ path, module, access }) => {
        const load = pageModules[`./routes/${module}.tsx`];
        if (!load) throw new Error(`No page file for ${module}.`);
        return path === '' ? { index: true, ...page(load, access) } : { path, ...page(load, access) };
      }),
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
