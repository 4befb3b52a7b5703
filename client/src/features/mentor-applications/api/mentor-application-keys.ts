export const mentorApplicationKeys = {
  all: ['mentor-applications'] as const,
  mine: () => [...mentorApplicationKeys.all, 'mine'] as const,
  lists: () => [...mentorApplicationKeys.all, 'list'] as const,
  list: (filters: { status?: string; page: number }) => [...mentorApplicationKeys.lists(), filters] as const,
};
