import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CloseCaseInput, ClosingState } from '@shared/closing-schemas';
import { api } from '../../../lib/api-client';
import { refreshAfterClosing } from './refresh-after-closing';

export function closeCase(caseId: number, input: CloseCaseInput): Promise<ClosingState> {
  return api.post<ClosingState>(`/api/cases/${caseId}/close`, input);
}

export function useCloseCase(caseId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CloseCaseInput) => closeCase(caseId, input),
    onSuccess: (state) => refreshAfterClosing(queryClient, state),
  });
}
