import type { QueryClient } from '@tanstack/react-query';
import { casesKeys } from '../../cases/api/cases-keys';
import { closingKeys } from '../../closing/api/closing-keys';
import { roundsKeys } from '../../rounds/api/rounds-keys';
import { threadKeys } from './thread-keys';

/** After a claim, hand-over or status move: the case, the rounds and the thread's system line
 * all changed, and so did who may close it. Awaited, so the button stays busy until the screen
 * shows the new state. */
export async function refreshAfterWorkflowChange(queryClient: QueryClient, caseId: number): Promise<void> {
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: casesKeys.detail(caseId) }),
    queryClient.invalidateQueries({ queryKey: casesKeys.lists() }),
    queryClient.invalidateQueries({ queryKey: roundsKeys.all }),
    queryClient.invalidateQueries({ queryKey: threadKeys.detail(caseId) }),
    queryClient.invalidateQueries({ queryKey: closingKeys.detail(caseId) }),
  ]);
}
