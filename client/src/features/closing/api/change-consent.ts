import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClosingState, ConsentInput } from '@shared/closing-schemas';
import { api } from '../../../lib/api-client';
import { refreshAfterClosing } from './refresh-after-closing';

export function changeConsent(caseId: number, input: ConsentInput): Promise<ClosingState> {
  return api.post<ClosingState>(`/api/cases/${caseId}/consent`, input);
}

export function useChangeConsent(caseId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ConsentInput) => changeConsent(caseId, input),
    onSuccess: (state) => refreshAfterClosing(queryClient, state),
  });
}
