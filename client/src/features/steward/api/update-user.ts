import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StewardUser, UserChangeInput } from '@shared/steward-schemas';
import { api } from '../../../lib/api-client';
import { authKeys } from '../../auth/api/auth-keys';
import { stewardKeys } from './steward-keys';

export function updateUser(id: number, change: UserChangeInput): Promise<StewardUser> {
  return api.patch(`/api/steward/users/${id}`, change);
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: number; change: UserChangeInput }) => updateUser(id, change),
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: stewardKeys.users() }),
        queryClient.invalidateQueries({ queryKey: stewardKeys.audit() }),
        queryClient.invalidateQueries({ queryKey: stewardKeys.metrics() }),
        // The steward may have changed their own role.
        queryClient.invalidateQueries({ queryKey: authKeys.me() }),
      ]);
    },
  });
}
