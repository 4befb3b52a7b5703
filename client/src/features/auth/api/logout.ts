import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { api } from '../../../lib/api-client';
import { authKeys, isPerUserQuery } from './auth-keys';

export function logout(): Promise<void> {
  return api.post<void>('/api/auth/logout');
}

/** Signs out, leaves for the landing page, then drops every per-user cache entry so nothing
 * private lingers on a shared phone. Leaving first keeps the current page from refetching. */
export function useLogout() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: logout,
    onSuccess: async () => {
      queryClient.setQueryData(authKeys.me(), null);
      await navigate('/');
      queryClient.removeQueries({ predicate: isPerUserQuery });
    },
  });
}
