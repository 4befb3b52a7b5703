// General → specific, so one invalidation can reach every case's closing or just one.
export const closingKeys = {
  all: ['closing'] as const,
  details: () => [...closingKeys.all, 'detail'] as const,
  detail: (caseId: number) => [...closingKeys.details(), caseId] as const,
};
