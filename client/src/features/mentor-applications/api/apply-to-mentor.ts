import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MentorApplication, MentorApplicationInput } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { mentorApplicationKeys } from './mentor-application-keys';

export function applyToMentor(input: MentorApplicationInput): Promise<MentorApplication> {
  return api.post('/api/mentor-applications', input);
}

export function useApplyToMentor() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: applyToMentor,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: mentorApplicationKeys.all });
    },
  });
}
