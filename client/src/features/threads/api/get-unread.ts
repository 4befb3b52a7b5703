import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { threadKeys } from './thread-keys';

export interface UnreadCounts {
  total: number;
  /** case id → messages the viewer has not read yet */
  byCase: Record<string, number>;
}

export function getUnread(signal?: AbortSignal): Promise<UnreadCounts> {
  return api.get<UnreadCounts>('/api/cases/unread', { signal });
}

export const unreadQueryOptions = () =>
  queryOptions({
    queryKey: threadKeys.unread(),
    queryFn: ({ signal }) => getUnread(signal),
    // The `unread` socket hint refreshes it at once; the slow poll covers a dropped socket.
    refetchInterval: 120_000,
  });

export function useUnread(enabled: boolean) {
  return useQuery({ ...unreadQueryOptions(), enabled });
}
