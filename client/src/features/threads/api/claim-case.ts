import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { refreshAfterWorkflowChange } from './workflow-change';

export function claimCase(caseId: number): Promise<unknown> {
  return api.post(`/api/cases/${caseId}/claim`);
}

export function useClaimCase() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: claimCase,
    onSuccess: (_answer, caseId) => refreshAfterWorkflowChange(queryClient, caseId),
  });
}
