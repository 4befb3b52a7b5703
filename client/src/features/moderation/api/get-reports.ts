import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { MessageReport, Paged, ReportStatus } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { queryString } from '../../steward/api/steward-keys';
import { moderationKeys } from './moderation-keys';

export const REPORTS_PAGE_SIZE = 10;

export function getReports(filters: { status: ReportStatus; page: number }, signal?: AbortSignal): Promise<Paged<MessageReport>> {
  return api.get(`/api/steward/reports${queryString({ ...filters, pageSize: REPORTS_PAGE_SIZE })}`, { signal });
}

export const reportsQueryOptions = (filters: { status: ReportStatus; page: number }) =>
  queryOptions({
    queryKey: moderationKeys.list(filters),
    queryFn: ({ signal }) => getReports(filters, signal),
    placeholderData: keepPreviousData,
  });

export function useReports(filters: { status: ReportStatus; page: number }) {
  return useQuery(reportsQueryOptions(filters));
}
