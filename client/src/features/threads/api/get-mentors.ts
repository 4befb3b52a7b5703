import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { threadKeys } from './thread-keys';

export interface MentorChoice {
  id: number;
  displayName: string;
}

/** The mentors a case can be handed to. Only stewards may list users, so only they get this. */
export async function getMentors(signal?: AbortSignal): Promise<MentorChoice[]> {
  const { items } = await api.get<{ items: Array<MentorChoice & { disabled?: boolean }> }>('/api/steward/users?role=mentor&pageSize=100', { signal });
  return items.filter((m) => !m.disabled).map(({ id, displayName }) => ({ id, displayName }));
}

export const mentorsQueryOptions = () =>
  queryOptions({ queryKey: threadKeys.mentors(), queryFn: ({ signal }) => getMentors(signal), staleTime: 5 * 60_000 });

export function useMentorChoices(enabled: boolean) {
  return useQuery({ ...mentorsQueryOptions(), enabled });
}
