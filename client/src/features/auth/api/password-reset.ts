import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export function requestPasswordReset(email: string): Promise<{ ok: true; message: string }> {
  return api.post('/api/auth/password-reset/request', { email });
}

export function resetPassword(input: { token: string; password: string }): Promise<{ ok: true }> {
  return api.post('/api/auth/password-reset', input);
}

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });
export const useResetPassword = () => useMutation({ mutationFn: resetPassword });
