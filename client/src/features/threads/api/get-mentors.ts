import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MentorChoice, MentorChoiceList } from '@shared/library-schemas';
import { api } from '../../../lib/api-client';
import { threadKeys } from './thread-keys';

export type { MentorChoice };

/** GET /api/mentors (mentors and stewards): the active mentors a case can be handed to, least loaded first. */
export async function getMentors(signal?: AbortSignal): Promise<MentorChoice[]> {
  const { items } = await api.get<MentorChoiceList>('/api/mentors', { signal });
  return items;
}

// Short-lived: the open-case counts are what someone choosing a mentor goes by.
export const mentorsQueryOptions = () => queryOptions({ queryKey: threadKeys.mentors(), queryFn: ({ signal }) => getMentors(signal), staleTime: 30_000 });

export function useMentorChoices(enabled: boolean) {
  return useQuery({ ...mentorsQueryOptions(), enabled });
}
