import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { batchesKeys } from './batches-keys';
import type { BatchView } from '@shared/case-schemas';

export interface BatchList {
  items: BatchView[];
  total: number;
  page: number;
  pageSize: number;
}

export function getBatches(signal?: AbortSignal): Promise<BatchList> {
  return api.get<BatchList>('/api/batches?pageSize=100', { signal });
}

export const batchesQueryOptions = () =>
  queryOptions({
    queryKey: batchesKeys.list(),
    queryFn: ({ signal }) => getBatches(signal),
  });

export function useBatches() {
  return useQuery(batchesQueryOptions());
}
