import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { SimilarDraftInput, SimilarItem } from '@shared/case-schemas';
import { api } from '../../../lib/api-client';
import { casesKeys } from './cases-keys';

export interface SimilarList {
  items: SimilarItem[];
}

/** POST /api/cases/similar: resolved cases like the unsaved draft. */
export function getSimilarToDraft(draft: SimilarDraftInput, signal?: AbortSignal): Promise<SimilarList> {
  return api.post<SimilarList>('/api/cases/similar', draft, { signal });
}

/** GET /api/cases/:id/similar */
export function getSimilarToCase(id: number, signal?: AbortSignal): Promise<SimilarList> {
  return api.get<SimilarList>(`/api/cases/${id}/similar`, { signal });
}

export const similarToDraftQueryOptions = (draft: SimilarDraftInput) =>
  queryOptions({
    queryKey: casesKeys.similarToDraft(draft),
    queryFn: ({ signal }) => getSimilarToDraft(draft, signal),
    staleTime: 5 * 60_000,
  });

export const similarToCaseQueryOptions = (id: number) =>
  queryOptions({
    queryKey: casesKeys.similarToCase(id),
    queryFn: ({ signal }) => getSimilarToCase(id, signal),
  });

/** Keeps the last list on screen while the next draft is asked about, so it does not flicker
 * as the grower types. `draft` null means there is nothing to ask about yet. */
export function useSimilarToDraft(draft: SimilarDraftInput | null) {
  return useQuery({
    ...similarToDraftQueryOptions(draft ?? {}),
    enabled: draft !== null,
    placeholderData: keepPreviousData,
  });
}

export function useSimilarToCase(id: number) {
  return useQuery(similarToCaseQueryOptions(id));
}
