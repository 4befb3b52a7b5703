import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CaseDetail, OpenCaseInput } from '@shared/case-schemas';
import { api } from '../../../lib/api-client';
import { batchesKeys } from '../../batches/api/batches-keys';
import { casesKeys } from './cases-keys';

/** POST /api/cases → 201 with the new case. */
export function createCase(input: OpenCaseInput): Promise<CaseDetail> {
  return api.post<CaseDetail>('/api/cases', input);
}

export function useCreateCase() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCase,
    onSuccess: async (created, input) => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: casesKeys.lists() }),
        // The batch page lists the cases opened about it.
        input.batchId ? queryClient.invalidateQueries({ queryKey: batchesKeys.detail(input.batchId) }) : undefined,
      ]);
      return created;
    },
  });
}
