import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LibraryEntry } from '@shared/library-schemas';
import { api } from '../../../lib/api-client';
import { libraryKeys } from './library-keys';

/** GET /api/library/:slug — a guide or a field note. */
export function getLibraryEntry(slug: string, signal?: AbortSignal): Promise<LibraryEntry> {
  return api.get<LibraryEntry>(`/api/library/${encodeURIComponent(slug)}`, { signal });
}

export const libraryEntryQueryOptions = (slug: string) =>
  queryOptions({
    queryKey: libraryKeys.detail(slug),
    queryFn: ({ signal }) => getLibraryEntry(slug, signal),
    meta: { sameForEveryone: true },
    staleTime: 60_000,
  });

export function useLibraryEntry(slug: string) {
  return useQuery(libraryEntryQueryOptions(slug));
}
