import type { LibrarySearch } from './search-library';

// General → specific: every library query, the lists, one list, the pages, one page.
export const libraryKeys = {
  all: ['library'] as const,
  lists: () => [...libraryKeys.all, 'list'] as const,
  list: (search: LibrarySearch) => [...libraryKeys.lists(), search] as const,
  details: () => [...libraryKeys.all, 'detail'] as const,
  detail: (slug: string) => [...libraryKeys.details(), slug] as const,
};
