import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClosingState, RecoveryReportInput } from '@shared/closing-schemas';
import { api } from '../../../lib/api-client';
import { refreshAfterClosing } from './refresh-after-closing';

export function fileRecoveryReport(caseId: number, input: RecoveryReportInput): Promise<ClosingState> {
  return api.post<ClosingState>(`/api/cases/${caseId}/recovery-report`, input);
}

export function useFileRecoveryReport(caseId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: RecoveryReportInput) => fileRecoveryReport(caseId, input),
    onSuccess: (state) => refreshAfterClosing(queryClient, state),
  });
}
