import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { LibraryList, LibraryQuery } from '@shared/library-schemas';
import { api } from '../../../lib/api-client';
import { paramsFromSearch } from '../lib/library-params';
import { libraryKeys } from './library-keys';

export type LibrarySearch = Partial<Pick<LibraryQuery, 'q' | 'stage' | 'kind' | 'page'>> & { symptom?: string[] };

/** GET /api/library — open to visitors. */
export function searchLibrary(search: LibrarySearch, signal?: AbortSignal): Promise<LibraryList> {
  const query = paramsFromSearch(search).toString();
  return api.get<LibraryList>(`/api/library${query ? `?${query}` : ''}`, { signal });
}

export const libraryListQueryOptions = (search: LibrarySearch) =>
  queryOptions({
    queryKey: libraryKeys.list(search),
    queryFn: ({ signal }) => searchLibrary(search, signal),
    // The same for every reader: kept when the person signed in changes.
    meta: { sameForEveryone: true },
    staleTime: 60_000,
  });

export function useLibrarySearch(search: LibrarySearch) {
  // The last answer stays on screen while the next one loads, so results do not flash away.
  return useQuery({ ...libraryListQueryOptions(search), placeholderData: keepPreviousData });
}
