export const moderationKeys = {
  all: ['moderation'] as const,
  lists: () => [...moderationKeys.all, 'reports'] as const,
  list: (filters: { status: string; page: number }) => [...moderationKeys.lists(), filters] as const,
};
