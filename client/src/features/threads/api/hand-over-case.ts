import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { refreshAfterWorkflowChange } from './workflow-change';

export interface HandOverInput {
  caseId: number;
  mentorId: number;
}

export function handOverCase({ caseId, mentorId }: HandOverInput): Promise<unknown> {
  return api.post(`/api/cases/${caseId}/hand-over`, { mentorId });
}

export function useHandOverCase() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: handOverCase,
    onSuccess: (_answer, { caseId }) => refreshAfterWorkflowChange(queryClient, caseId),
  });
}
