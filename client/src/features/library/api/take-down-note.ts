import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClosingState } from '@shared/closing-schemas';
import { api } from '../../../lib/api-client';
import { casesKeys } from '../../cases/api/cases-keys';
import { closingKeys } from '../../closing/api/closing-keys';
import { threadKeys } from '../../threads/api/thread-keys';
import { stewardKeys } from '../../steward/api/steward-keys';
import { libraryKeys } from './library-keys';

/** A steward takes a field note out of the Field Library (POST /api/library/:slug/take-down). */
export function takeDownNote(slug: string, reason: string): Promise<ClosingState> {
  return api.post<ClosingState>(`/api/library/${slug}/take-down`, { reason });
}

export function useTakeDownNote(slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (reason: string) => takeDownNote(slug, reason),
    onSuccess: async (state) => {
      queryClient.setQueryData(closingKeys.detail(state.caseId), state);
      // The page stays on screen (it says the note is out); its own copy is only marked stale,
      // so it is asked for again (and found gone) the next time it is opened.
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: libraryKeys.detail(slug), refetchType: 'none' }),
        queryClient.invalidateQueries({ queryKey: libraryKeys.lists() }),
        queryClient.invalidateQueries({ queryKey: casesKeys.detail(state.caseId) }),
        queryClient.invalidateQueries({ queryKey: threadKeys.detail(state.caseId) }),
        queryClient.invalidateQueries({ queryKey: stewardKeys.libraryHolds() }),
      ]);
    },
  });
}
