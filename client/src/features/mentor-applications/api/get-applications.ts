import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ApplicationStatus, MentorApplication, Paged } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { queryString } from '../../steward/api/steward-keys';
import { mentorApplicationKeys } from './mentor-application-keys';

export const APPLICATIONS_PAGE_SIZE = 10;

export function getApplications(filters: { status?: ApplicationStatus; page: number }, signal?: AbortSignal): Promise<Paged<MentorApplication>> {
  return api.get(`/api/steward/mentor-applications${queryString({ ...filters, pageSize: APPLICATIONS_PAGE_SIZE })}`, { signal });
}

export const applicationsQueryOptions = (filters: { status?: ApplicationStatus; page: number }) =>
  queryOptions({
    queryKey: mentorApplicationKeys.list(filters),
    queryFn: ({ signal }) => getApplications(filters, signal),
    placeholderData: keepPreviousData,
  });

export function useApplications(filters: { status?: ApplicationStatus; page: number }) {
  return useQuery(applicationsQueryOptions(filters));
}
