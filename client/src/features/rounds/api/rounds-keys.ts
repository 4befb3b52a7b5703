import type { RoundsFilters } from '../lib/rounds-filters';

export const roundsKeys = {
  all: ['rounds'] as const,
  lists: () => [...roundsKeys.all, 'list'] as const,
  list: (filters: RoundsFilters) => [...roundsKeys.lists(), filters] as const,
  mailChoice: (choice: string) => [...roundsKeys.all, 'mail-choice', choice] as const,
};
