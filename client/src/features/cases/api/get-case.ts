import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CaseDetail } from '@shared/case-schemas';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

export function getCase(id: number, signal?: AbortSignal): Promise<CaseDetail> {
  return api.get<CaseDetail>(`/api/cases/${id}`, { signal });
}

export const caseQueryOptions = (id: number) =>
  queryOptions({
    queryKey: casesKeys.detail(id),
    queryFn: ({ signal }) => getCase(id, signal),
  });

export function useCase(id: number) {
  return useQuery(caseQueryOptions(id));
}
