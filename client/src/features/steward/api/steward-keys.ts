// Query keys for the steward desk, general → specific, so one invalidation reaches every page
// and filter of a list.
export interface UserFilters {
  q?: string;
  role?: string;
  page: number;
}

export const stewardKeys = {
  all: ['steward'] as const,
  users: () => [...stewardKeys.all, 'users'] as const,
  userList: (filters: UserFilters) => [...stewardKeys.users(), filters] as const,
  audit: () => [...stewardKeys.all, 'audit'] as const,
  auditPage: (page: number) => [...stewardKeys.audit(), page] as const,
  metrics: () => [...stewardKeys.all, 'metrics'] as const,
  metricsRange: (range: { from?: string; to?: string }) => [...stewardKeys.metrics(), range] as const,
  libraryHolds: () => [...stewardKeys.all, 'library-holds'] as const,
  libraryHoldsPage: (page: number) => [...stewardKeys.libraryHolds(), page] as const,
  mail: () => [...stewardKeys.all, 'mail'] as const,
  mailPage: (page: number) => [...stewardKeys.mail(), page] as const,
};

/** `?a=1&b=x`, leaving out empty values. */
export function queryString(params: Record<string, string | number | undefined>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) if (value !== undefined && value !== '') search.set(key, String(value));
  const text = search.toString();
  return text ? `?${text}` : '';
}
