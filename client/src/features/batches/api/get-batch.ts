import { queryOptions, useQuery, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { api } from '../../../lib/api-client';
import { routeIdOf } from '../lib/route-id';
import { batchesKeys } from './batches-keys';
import type { BatchView } from '@shared/case-schemas';

export function getBatch(id: number, signal?: AbortSignal): Promise<BatchView> {
  return api.get<BatchView>(`/api/batches/${id}`, { signal });
}

export const batchQueryOptions = (id: number) =>
  queryOptions({
    queryKey: batchesKeys.detail(id),
    queryFn: ({ signal }) => getBatch(id, signal),
  });

export function useBatch(id: number | null) {
  return useQuery({ ...batchQueryOptions(id ?? 0), enabled: id !== null });
}

/** The loader of the pages under /batches/:id: a batch that is not the grower's is a 404. */
export const batchRouteLoader = (queryClient: QueryClient) => async ({ params }: LoaderFunctionArgs) => {
  await queryClient.ensureQueryData(batchQueryOptions(routeIdOf(params.id)));
  return null;
};

/** The batch of the page's :id, already in the cache thanks to `batchRouteLoader`. */
export function useRouteBatch() {
  const id = routeIdOf(useParams().id);
  return useSuspenseQuery(batchQueryOptions(id)).data;
}
