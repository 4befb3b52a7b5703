import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ThreadMessage } from '@shared/socket-events';
import { api } from '../../../lib/api-client';
import { mergeMessages } from '../lib/merge-messages';
import { threadKeys } from './thread-keys';

export async function getThread(caseId: number, signal?: AbortSignal): Promise<ThreadMessage[]> {
  const { items } = await api.get<{ items: ThreadMessage[] }>(`/api/cases/${caseId}/messages`, { signal });
  return items;
}

export const threadQueryOptions = (caseId: number) =>
  queryOptions({
    queryKey: threadKeys.detail(caseId),
    queryFn: ({ signal }) => getThread(caseId, signal),
    // Live events keep the thread current; a refetch that started before a broadcast and
    // finished after it must not drop that message, so a refetch merges instead of replacing.
    structuralSharing: (previous: unknown, next: unknown) =>
      mergeMessages((previous as ThreadMessage[] | undefined) ?? [], next as ThreadMessage[]),
    staleTime: 60_000,
  });

export function useThread(caseId: number) {
  return useQuery(threadQueryOptions(caseId));
}
