import { queryOptions, useQuery } from '@tanstack/react-query';
import type { VocabularyItem } from '@shared/vocabulary';
import { api } from '../../../lib/api-client';
import { vocabularyKeys } from './vocabulary-keys';

export interface Vocabulary {
  stages: VocabularyItem[];
  symptoms: VocabularyItem[];
  causes: VocabularyItem[];
  remedies: VocabularyItem[];
}

export function getVocabulary(signal?: AbortSignal): Promise<Vocabulary> {
  return api.get<Vocabulary>('/api/vocabulary', { signal });
}

// The lists change only with a release, so one fetch per page load is enough.
export const vocabularyQueryOptions = () =>
  queryOptions({
    queryKey: vocabularyKeys.all,
    queryFn: ({ signal }) => getVocabulary(signal),
    staleTime: Infinity,
    gcTime: Infinity,
    meta: { sameForEveryone: true },
  });

export function useVocabulary() {
  return useQuery(vocabularyQueryOptions());
}
