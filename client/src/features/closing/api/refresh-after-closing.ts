import { hashKey, type QueryClient } from '@tanstack/react-query';
import type { ClosingState } from '@shared/closing-schemas';
import { casesKeys } from '../../cases/api/cases-keys';
import { libraryKeys } from '../../library/api/library-keys';
import { stewardKeys } from '../../steward/api/steward-keys';
import { threadKeys } from '../../threads/api/thread-keys';
import { closingKeys } from './closing-keys';

/** After any closing step: the answer is the new closing state; the case, its thread, the rounds
 * and the Field Library may all have changed with it. `onLibraryPage`: the step was taken on that
 * field note's own page, which stays on screen as it is (it says what happened); its copy is only
 * marked stale, so it is asked for again the next time it is opened. */
export async function refreshAfterClosing(queryClient: QueryClient, state: ClosingState, { onLibraryPage }: { onLibraryPage?: string } = {}): Promise<void> {
  queryClient.setQueryData(closingKeys.detail(state.caseId), state);
  const shown = onLibraryPage ? hashKey(libraryKeys.detail(onLibraryPage)) : null;
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: casesKeys.detail(state.caseId) }),
    queryClient.invalidateQueries({ queryKey: casesKeys.lists() }),
    queryClient.invalidateQueries({ queryKey: threadKeys.detail(state.caseId) }),
    queryClient.invalidateQueries({ queryKey: libraryKeys.all, predicate: (query) => query.queryHash !== shown }),
    ...(onLibraryPage ? [queryClient.invalidateQueries({ queryKey: libraryKeys.detail(onLibraryPage), refetchType: 'none' })] : []),
    // A note taken out, or put back, changes the desk's list of notes held out.
    queryClient.invalidateQueries({ queryKey: stewardKeys.libraryHolds() }),
  ]);
}
