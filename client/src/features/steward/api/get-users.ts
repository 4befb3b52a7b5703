import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Paged, StewardUser } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { queryString, stewardKeys, type UserFilters } from './steward-keys';

export const PEOPLE_PAGE_SIZE = 20;

export function getStewardUsers(filters: UserFilters, signal?: AbortSignal): Promise<Paged<StewardUser>> {
  return api.get(`/api/steward/users${queryString({ ...filters, pageSize: PEOPLE_PAGE_SIZE })}`, { signal });
}

export const stewardUsersQueryOptions = (filters: UserFilters) =>
  queryOptions({
    queryKey: stewardKeys.userList(filters),
    queryFn: ({ signal }) => getStewardUsers(filters, signal),
    placeholderData: keepPreviousData,
  });

export function useStewardUsers(filters: UserFilters) {
  return useQuery(stewardUsersQueryOptions(filters));
}
