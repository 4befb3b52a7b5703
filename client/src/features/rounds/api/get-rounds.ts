import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CaseListItem } from '@shared/case-schemas';
import { api } from '../../../lib/api-client';
import { apiQueryFromFilters, type RoundsFilters } from '../lib/rounds-filters';
import { roundsKeys } from './rounds-keys';

export interface RoundsPage {
  items: CaseListItem[];
  total: number;
  page: number;
  pageSize: number;
}

export function getRounds(filters: RoundsFilters, signal?: AbortSignal): Promise<RoundsPage> {
  return api.get<RoundsPage>(`/api/cases?${apiQueryFromFilters(filters)}`, { signal });
}

/** Refreshed every 30 s while the page is open (and at once on a live hint, see the rounds
 * page): waiting hours climb and new cases arrive even when nobody touches the filters. */
export const ROUNDS_POLL_MS = 30_000;

export const roundsQueryOptions = (filters: RoundsFilters) =>
  queryOptions({
    queryKey: roundsKeys.list(filters),
    queryFn: ({ signal }) => getRounds(filters, signal),
    staleTime: 15_000,
    refetchInterval: ROUNDS_POLL_MS,
    // Changing a filter keeps the old rows on screen (dimmed) instead of flashing a spinner.
    placeholderData: keepPreviousData,
  });

export function useRounds(filters: RoundsFilters) {
  return useQuery(roundsQueryOptions(filters));
}
