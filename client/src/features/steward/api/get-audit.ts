import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AuditEntry, Paged } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { queryString, stewardKeys } from './steward-keys';

export const AUDIT_PAGE_SIZE = 25;

export function getAudit(page: number, signal?: AbortSignal): Promise<Paged<AuditEntry>> {
  return api.get(`/api/steward/audit${queryString({ page, pageSize: AUDIT_PAGE_SIZE })}`, { signal });
}

export const auditQueryOptions = (page: number) =>
  queryOptions({
    queryKey: stewardKeys.auditPage(page),
    queryFn: ({ signal }) => getAudit(page, signal),
    placeholderData: keepPreviousData,
  });

export function useAudit(page: number) {
  return useQuery(auditQueryOptions(page));
}
