import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MentorProfile } from '@shared/library-schemas';
import { api } from '../../../lib/api-client';
import { mentorsKeys } from './mentors-keys';

/** PATCH /api/mentors/me — what growers read about the signed-in mentor on their profile. */
export function useSetAbout(mentorId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (about: string) => api.patch<{ about: string | null }>('/api/mentors/me', { about }),
    onSuccess: ({ about }) => {
      queryClient.setQueryData<MentorProfile>(mentorsKeys.detail(mentorId), (old) => (old ? { ...old, about } : old));
    },
  });
}
