import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { batchesKeys } from './batches-keys';
import type { BatchView } from '@shared/case-schemas';

export interface BatchList {
  items: BatchView[];
  total: number;
  page: number;
  pageSize: number;
  /** how many batches are on the shelf and how many were taken off it */
  counts: { onShelf: number; finished: number };
}

/** The batches on the shelf, or (`finished`) those taken off it. */
export function getBatches(finished: boolean, signal?: AbortSignal): Promise<BatchList> {
  return api.get<BatchList>(`/api/batches?pageSize=100${finished ? '&finished=true' : ''}`, { signal });
}

export const batchesQueryOptions = (finished = false) =>
  queryOptions({
    queryKey: batchesKeys.list(finished ? { finished: 'true' } : {}),
    queryFn: ({ signal }) => getBatches(finished, signal),
  });

export function useBatches(finished = false) {
  return useQuery(batchesQueryOptions(finished));
}
