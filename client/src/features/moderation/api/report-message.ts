import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ReportReceipt } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { moderationKeys } from './moderation-keys';

export function reportMessage(messageId: number, reason: string): Promise<ReportReceipt> {
  return api.post(`/api/messages/${messageId}/reports`, { reason });
}

export function useReportMessage() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ messageId, reason }: { messageId: number; reason: string }) => reportMessage(messageId, reason),
    // Only a steward has the report list cached; for anyone else this is a no-op.
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: moderationKeys.all });
    },
  });
}
