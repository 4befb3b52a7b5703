import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { batchesKeys } from './batches-keys';
import type { BatchPatchInput, BatchView } from '@shared/case-schemas';

export function updateBatch(id: number, input: BatchPatchInput): Promise<BatchView> {
  return api.patch<BatchView>(`/api/batches/${id}`, input);
}

export function useUpdateBatch(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: BatchPatchInput) => updateBatch(id, input),
    onSuccess: async (batch) => {
      queryClient.setQueryData(batchesKeys.detail(id), batch);
      await queryClient.invalidateQueries({ queryKey: batchesKeys.lists() });
    },
  });
}
