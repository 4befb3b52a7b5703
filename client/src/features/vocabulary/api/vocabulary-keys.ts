export const vocabularyKeys = {
  all: ['vocabulary'] as const,
};
