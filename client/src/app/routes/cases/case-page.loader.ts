// The case page's loader, apart from the page so it can start while the page's code loads
// (see page() in app/router.tsx).
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router';
import { routeIdOf } from '../../../features/batches/lib/route-id';
import { caseQueryOptions } from '../../../features/cases/api/get-case';

export const caseLoader = (queryClient: QueryClient) => async ({ params }: LoaderFunctionArgs) => {
  // Someone who may not read the case gets a 404 from the server, and the page says so.
  await queryClient.ensureQueryData(caseQueryOptions(routeIdOf(params.id)));
  return null;
};
