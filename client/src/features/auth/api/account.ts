import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PasswordChangeInput, PublicUser } from '@shared/auth-schemas';
import { api } from '../../../lib/api-client';
import { authKeys } from './auth-keys';

/** PATCH /api/auth/me: the name others see. */
export function useRename() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (displayName: string) => api.patch<PublicUser>('/api/auth/me', { displayName }),
    onSuccess: (user) => queryClient.setQueryData(authKeys.me(), user),
  });
}

/** POST /api/auth/password: the current password, then the new one; other sessions end. */
export function useChangePassword() {
  return useMutation({ mutationFn: (input: PasswordChangeInput) => api.post<{ ok: true }>('/api/auth/password', input) });
}
