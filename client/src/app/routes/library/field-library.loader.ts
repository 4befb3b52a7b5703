// The Field Library's loader, apart from the page so it can start while the page's code loads
// (see page() in app/router.tsx).
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { libraryListQueryOptions } from '../../../features/library/api/search-library';
import { searchFromParams } from '../../../features/library/lib/library-params';

export const fieldLibraryLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  // Warm, not wait: a slow answer shows the page with its spinner rather than holding it back.
  void queryClient.prefetchQuery(libraryListQueryOptions(searchFromParams(new URL(request.url).searchParams)));
  return null;
};
