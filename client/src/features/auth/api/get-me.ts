import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PublicUser } from '@shared/auth-schemas';
import { api, isApiError } from '../../../lib/api-client';
import { authKeys } from './auth-keys';

/** The signed-in user, or null for a visitor (the server answers 401). */
export async function getMe(signal?: AbortSignal): Promise<PublicUser | null> {
  try {
    return await api.get<PublicUser>('/api/auth/me', { signal });
  } catch (error) {
    if (isApiError(error, 401)) return null;
    throw error;
  }
}

/** Coming back to the tab asks again once the answer is this old, whatever staleTime says. */
export const ME_FOCUS_RECHECK_MS = 30_000;

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
    // A role can change while the tab sits in the background (a steward approves an
    // application to mentor): one small request when the person comes back puts the right
    // pages in the header. The socket's account:changed and any 403 ask at once as well.
    refetchOnWindowFocus: (query) => (Date.now() - query.state.dataUpdatedAt > ME_FOCUS_RECHECK_MS ? 'always' : false),
    // Route loaders wait on this; when the server is down we show the visitor's view at once
    // instead of holding the page through retries.
    retry: false,
  });

/** `data` is the user, null when signed out, undefined until the first answer. */
export function useUser() {
  return useQuery(meQueryOptions());
}
