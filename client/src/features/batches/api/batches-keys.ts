export const batchesKeys = {
  all: ['batches'] as const,
  lists: () => [...batchesKeys.all, 'list'] as const,
  list: (filters: Record<string, string | number | undefined> = {}) => [...batchesKeys.lists(), filters] as const,
  details: () => [...batchesKeys.all, 'detail'] as const,
  detail: (id: number) => [...batchesKeys.details(), id] as const,
};
