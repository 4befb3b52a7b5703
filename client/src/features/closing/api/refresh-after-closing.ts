import type { QueryClient } from '@tanstack/react-query';
import type { ClosingState } from '@shared/closing-schemas';
import { casesKeys } from '../../cases/api/cases-keys';
import { libraryKeys } from '../../library/api/library-keys';
import { stewardKeys } from '../../steward/api/steward-keys';
import { threadKeys } from '../../threads/api/thread-keys';
import { closingKeys } from './closing-keys';

/** After any closing step: the answer is the new closing state; the case, its thread, the rounds
 * and the Field Library may all have changed with it. */
export async function refreshAfterClosing(queryClient: QueryClient, state: ClosingState): Promise<void> {
  queryClient.setQueryData(closingKeys.detail(state.caseId), state);
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: casesKeys.detail(state.caseId) }),
    queryClient.invalidateQueries({ queryKey: casesKeys.lists() }),
    queryClient.invalidateQueries({ queryKey: threadKeys.detail(state.caseId) }),
    queryClient.invalidateQueries({ queryKey: libraryKeys.all }),
    // A steward putting a note back takes it off the desk's list of notes held out.
    queryClient.invalidateQueries({ queryKey: stewardKeys.libraryHolds() }),
  ]);
}
