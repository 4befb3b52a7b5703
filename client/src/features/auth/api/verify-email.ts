import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PublicUser } from '@shared/auth-schemas';
import { api } from '../../../lib/api-client';
import { authKeys } from './auth-keys';

export function verifyEmail(token: string): Promise<PublicUser> {
  return api.post<PublicUser>('/api/auth/verify-email', { token });
}

export function useVerifyEmail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: verifyEmail,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: authKeys.me() }),
  });
}
