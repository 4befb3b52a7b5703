import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CaseListItem } from '@shared/case-schemas';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

export interface CaseList {
  items: CaseListItem[];
  total: number;
  page: number;
  pageSize: number;
}

/** GET /api/cases?mine=1: the signed-in grower's own cases, newest first. */
export function getMyCases(signal?: AbortSignal): Promise<CaseList> {
  return api.get<CaseList>('/api/cases?mine=1&status=all&sort=newest', { signal });
}

export const myCasesQueryOptions = () =>
  queryOptions({
    queryKey: casesKeys.list({ mine: true }),
    queryFn: ({ signal }) => getMyCases(signal),
  });

export function useMyCases() {
  return useQuery(myCasesQueryOptions());
}
