import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { LibraryHoldItem, Paged } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { queryString, stewardKeys } from './steward-keys';

export const LIBRARY_HOLDS_PAGE_SIZE = 25;

export type LibraryHoldRow = LibraryHoldItem & { id: number };

export async function getLibraryHolds(page: number, signal?: AbortSignal): Promise<Paged<LibraryHoldRow>> {
  const answer = await api.get<Paged<LibraryHoldItem>>(`/api/steward/library-holds${queryString({ page, pageSize: LIBRARY_HOLDS_PAGE_SIZE })}`, { signal });
  // One hold per case: the case is the row's identity.
  return { ...answer, items: answer.items.map((item) => ({ ...item, id: item.caseId })) };
}

export function useLibraryHolds(page: number) {
  return useQuery(
    queryOptions({
      queryKey: stewardKeys.libraryHoldsPage(page),
      queryFn: ({ signal }) => getLibraryHolds(page, signal),
      placeholderData: keepPreviousData,
    }),
  );
}
