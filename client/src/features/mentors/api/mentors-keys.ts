export const mentorsKeys = {
  all: ['mentors'] as const,
  details: () => [...mentorsKeys.all, 'detail'] as const,
  detail: (id: number) => [...mentorsKeys.details(), id] as const,
};
