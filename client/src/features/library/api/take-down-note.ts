import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClosingState } from '@shared/closing-schemas';
import { api } from '../../../lib/api-client';
import { refreshAfterClosing } from '../../closing/api/refresh-after-closing';

/** A steward takes a field note out of the Field Library (POST /api/library/:slug/take-down). */
export function takeDownNote(slug: string, reason: string): Promise<ClosingState> {
  return api.post<ClosingState>(`/api/library/${slug}/take-down`, { reason });
}

export function useTakeDownNote(slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (reason: string) => takeDownNote(slug, reason),
    // Taken on the note's own page, which stays on screen and says the note is out.
    onSuccess: (state) => refreshAfterClosing(queryClient, state, { onLibraryPage: slug }),
  });
}
