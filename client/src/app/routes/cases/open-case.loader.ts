// "Open a case"'s loader, apart from the page so it can start while the page's code loads
// (see page() in app/router.tsx).
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { batchQueryOptions } from '../../../features/batches/api/get-batch';
import { batchesQueryOptions } from '../../../features/batches/api/get-batches';
import { routeIdOf } from '../../../features/batches/lib/route-id';

export function batchParamOf(params: URLSearchParams): number | null {
  const raw = params.get('batch');
  return raw === null || raw === '' ? null : routeIdOf(raw);
}

export const openCaseLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  const batchId = batchParamOf(new URL(request.url).searchParams);
  // A batch that is not the grower's answers 404, and the page says it could not be found.
  if (batchId !== null) await queryClient.ensureQueryData(batchQueryOptions(batchId));
  else await queryClient.prefetchQuery(batchesQueryOptions());
  return null;
};
