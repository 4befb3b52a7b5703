import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HiddenMessage } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { stewardKeys } from '../../steward/api/steward-keys';
import { moderationKeys } from './moderation-keys';

export function hideMessage(messageId: number, note: string): Promise<HiddenMessage> {
  return api.post(`/api/steward/messages/${messageId}/hide`, { note });
}

export function useHideMessage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ messageId, note }: { messageId: number; note: string }) => hideMessage(messageId, note),
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: moderationKeys.all }),
        queryClient.invalidateQueries({ queryKey: stewardKeys.audit() }),
      ]);
    },
  });
}
