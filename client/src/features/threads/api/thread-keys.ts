// General → specific, so one invalidation can reach every thread or just one.
export const threadKeys = {
  all: ['threads'] as const,
  details: () => [...threadKeys.all, 'detail'] as const,
  detail: (caseId: number) => [...threadKeys.details(), caseId] as const,
  unread: () => [...threadKeys.all, 'unread'] as const,
  mentors: () => [...threadKeys.all, 'mentors'] as const,
};
