import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { batchesKeys } from './batches-keys';
import type { BatchCreateInput, BatchView } from '@shared/case-schemas';

export function createBatch(input: BatchCreateInput): Promise<BatchView> {
  return api.post<BatchView>('/api/batches', input);
}

export function useCreateBatch() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBatch,
    onSuccess: async (batch) => {
      queryClient.setQueryData(batchesKeys.detail(batch.id), batch);
      await queryClient.invalidateQueries({ queryKey: batchesKeys.lists() });
    },
  });
}
