import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CaughtMail, Paged } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { queryString, stewardKeys } from './steward-keys';

export const MAIL_PAGE_SIZE = 20;

/** The local catcher's mail; the server answers 404 when a real mail server is used. */
export function getCaughtMail(page: number, signal?: AbortSignal): Promise<Paged<CaughtMail>> {
  return api.get(`/api/steward/mail${queryString({ page, pageSize: MAIL_PAGE_SIZE })}`, { signal });
}

export const caughtMailQueryOptions = (page: number) =>
  queryOptions({
    queryKey: stewardKeys.mailPage(page),
    queryFn: ({ signal }) => getCaughtMail(page, signal),
    placeholderData: keepPreviousData,
    // Mail arrives on its own, a moment after whatever caused it.
    staleTime: 0,
  });

/** While the mail page is open it looks for new mail every few seconds. */
export function useCaughtMail(page: number) {
  return useQuery({ ...caughtMailQueryOptions(page), refetchInterval: 5_000 });
}
