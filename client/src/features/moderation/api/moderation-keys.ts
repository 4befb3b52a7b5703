import type { QueryClient } from '@tanstack/react-query';
import { stewardKeys } from '../../steward/api/steward-keys';

export const moderationKeys = {
  all: ['moderation'] as const,
  lists: () => [...moderationKeys.all, 'reports'] as const,
  list: (filters: { status: string; page: number }) => [...moderationKeys.lists(), filters] as const,
};

/** After a steward hides, shows again or dismisses: the reports and the audit log both moved. */
export function afterModeration(queryClient: QueryClient): Promise<unknown> {
  return Promise.all([queryClient.invalidateQueries({ queryKey: moderationKeys.all }), queryClient.invalidateQueries({ queryKey: stewardKeys.audit() })]);
}
