import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CommunityMetrics } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { queryString, stewardKeys } from './steward-keys';

export interface MetricsRange {
  from?: string;
  to?: string;
}

export function getMetrics(range: MetricsRange, signal?: AbortSignal): Promise<CommunityMetrics> {
  return api.get(`/api/steward/metrics${queryString({ from: range.from, to: range.to })}`, { signal });
}

export const metricsQueryOptions = (range: MetricsRange = {}) =>
  queryOptions({
    queryKey: stewardKeys.metricsRange(range),
    queryFn: ({ signal }) => getMetrics(range, signal),
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });

export function useMetrics(range: MetricsRange) {
  return useQuery(metricsQueryOptions(range));
}
