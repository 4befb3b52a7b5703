export const casesKeys = {
  all: ['cases'] as const,
  lists: () => [...casesKeys.all, 'list'] as const,
  list: (filters: Record<string, string | number | boolean | undefined> = {}) => [...casesKeys.lists(), filters] as const,
  details: () => [...casesKeys.all, 'detail'] as const,
  detail: (id: number) => [...casesKeys.details(), id] as const,
  similar: () => [...casesKeys.all, 'similar'] as const,
  similarToCase: (id: number) => [...casesKeys.similar(), 'case', id] as const,
  similarToDraft: (draft: unknown) => [...casesKeys.similar(), 'draft', draft] as const,
};
