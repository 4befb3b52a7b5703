import type { Query } from '@tanstack/react-query';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

/** Queries whose answer is the same for every visitor set `meta: { sameForEveryone: true }`;
 * all others are dropped or refetched when the person behind the session changes. */
export function isPerUserQuery(query: Query): boolean {
  return query.queryKey[0] !== authKeys.all[0] && query.meta?.sameForEveryone !== true;
}
