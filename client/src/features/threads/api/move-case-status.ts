import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CaseStatus } from '@shared/case-status';
import { api } from '../../../lib/api-client';
import { refreshAfterWorkflowChange } from './workflow-change';

export interface MoveInput {
  caseId: number;
  status: CaseStatus;
}

/** 409 `illegal_transition` when the case has moved on meanwhile (someone else got there first). */
export function moveCaseStatus({ caseId, status }: MoveInput): Promise<unknown> {
  return api.post(`/api/cases/${caseId}/status`, { status });
}

export function useMoveCaseStatus() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: moveCaseStatus,
    onSuccess: (_answer, { caseId }) => refreshAfterWorkflowChange(queryClient, caseId),
  });
}
