import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MentorProfile } from '@shared/library-schemas';
import { api } from '../../../lib/api-client';
import { mentorsKeys } from './mentors-keys';

/** GET /api/mentors/:id — signed in only. */
export function getMentor(id: number, signal?: AbortSignal): Promise<MentorProfile> {
  return api.get<MentorProfile>(`/api/mentors/${id}`, { signal });
}

export const mentorQueryOptions = (id: number) =>
  queryOptions({
    queryKey: mentorsKeys.detail(id),
    queryFn: ({ signal }) => getMentor(id, signal),
    staleTime: 60_000,
  });

export function useMentor(id: number) {
  return useQuery(mentorQueryOptions(id));
}
