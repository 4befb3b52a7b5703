import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

/** A new confirmation link to the signed-in person's address (at most one every two minutes). */
export function useResendVerification() {
  return useMutation({ mutationFn: () => api.post<{ ok: true }>('/api/auth/verify-email/resend', {}) });
}
