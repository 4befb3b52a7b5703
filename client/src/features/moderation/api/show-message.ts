import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShownMessage } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { afterModeration } from './moderation-keys';

/** A hidden message back in its thread (a steward's second look). */
export function useShowMessage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ messageId, note }: { messageId: number; note: string }) => api.post<ShownMessage>(`/api/steward/messages/${messageId}/show`, { note }),
    onSuccess: () => afterModeration(queryClient),
  });
}
