import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';
import { authKeys } from '../features/auth/api/auth-keys';

const MAX_RETRIES = 2;
export const ROLE_RECHECK_MS = 10_000;

// A 4xx will not change by asking again; a dropped connection or a 5xx might.
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
  return failureCount < MAX_RETRIES;
}

export function createQueryClient(): QueryClient {
  // A 401 from any other endpoint means the session ended (timeout, sign-out elsewhere,
  // account disabled): show the visitor's header rather than a stale name.
  // A 403 may mean the role changed since the user was last asked (a mentor stepped down, or
  // an approval this tab has not heard of): ask who is signed in, at most every few seconds.
  let lastRoleRecheck = 0;
  const onError = (error: unknown) => {
    if (!(error instanceof ApiError)) return;
    if (error.status === 401) client.setQueryData(authKeys.me(), null);
    if (error.status === 403 && Date.now() - lastRoleRecheck >= ROLE_RECHECK_MS) {
      lastRoleRecheck = Date.now();
      void client.invalidateQueries({ queryKey: authKeys.me() });
    }
  };
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError }),
    mutationCache: new MutationCache({ onError }),
    defaultOptions: {
      queries: { retry: shouldRetry, staleTime: 30_000 },
      mutations: { retry: false },
    },
  });
  return client;
}
