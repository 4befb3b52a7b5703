import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ApplicationDecisionInput, MentorApplication } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { stewardKeys } from '../../steward/api/steward-keys';
import { mentorApplicationKeys } from './mentor-application-keys';

export function decideApplication(id: number, input: ApplicationDecisionInput): Promise<MentorApplication> {
  return api.patch(`/api/steward/mentor-applications/${id}`, input);
}

export function useDecideApplication() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: ApplicationDecisionInput }) => decideApplication(id, input),
    onSuccess: async () => {
      // An approval changes a role: the people list, the audit log and mentors' load all move.
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: mentorApplicationKeys.all }),
        queryClient.invalidateQueries({ queryKey: stewardKeys.all }),
      ]);
    },
  });
}
