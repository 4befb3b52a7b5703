import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MentorApplication, Paged } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { mentorApplicationKeys } from './mentor-application-keys';

/** The signed-in grower's own applications, newest first. */
export function getMyApplications(signal?: AbortSignal): Promise<Paged<MentorApplication>> {
  return api.get('/api/mentor-applications?pageSize=10', { signal });
}

export const myApplicationsQueryOptions = () =>
  queryOptions({ queryKey: mentorApplicationKeys.mine(), queryFn: ({ signal }) => getMyApplications(signal) });

export function useMyApplications() {
  return useQuery(myApplicationsQueryOptions());
}
