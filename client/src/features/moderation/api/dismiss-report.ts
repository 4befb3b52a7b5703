import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MessageReport } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { afterModeration } from './moderation-keys';

export function dismissReport(reportId: number, note: string): Promise<MessageReport> {
  return api.post(`/api/steward/reports/${reportId}/dismiss`, { note });
}

export function useDismissReport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ reportId, note }: { reportId: number; note: string }) => dismissReport(reportId, note),
    onSuccess: () => afterModeration(queryClient),
  });
}
