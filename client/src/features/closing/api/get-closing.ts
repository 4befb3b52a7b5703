import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClosingState } from '@shared/closing-schemas';
import { api } from '../../../lib/api-client';
import { closingKeys } from './closing-keys';

/** GET /api/cases/:id/closing — the closing side of a case and what the viewer may do now. */
export function getClosing(caseId: number, signal?: AbortSignal): Promise<ClosingState> {
  return api.get<ClosingState>(`/api/cases/${caseId}/closing`, { signal });
}

export const closingQueryOptions = (caseId: number) =>
  queryOptions({
    queryKey: closingKeys.detail(caseId),
    queryFn: ({ signal }) => getClosing(caseId, signal),
  });

export function useClosing(caseId: number) {
  return useQuery(closingQueryOptions(caseId));
}
