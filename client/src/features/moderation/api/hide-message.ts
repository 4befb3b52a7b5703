import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HiddenMessage } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { afterModeration } from './moderation-keys';

export function hideMessage(messageId: number, note: string): Promise<HiddenMessage> {
  return api.post(`/api/steward/messages/${messageId}/hide`, { note });
}

export function useHideMessage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ messageId, note }: { messageId: number; note: string }) => hideMessage(messageId, note),
    onSuccess: () => afterModeration(queryClient),
  });
}
