import type { DrummerSearchQuery } from '@shared/schemas/profiles';

// Query keys of drummer search, general → specific.
export const searchKeys = {
  all: ['drummer-search'] as const,
  list: (query: DrummerSearchQuery) => [...searchKeys.all, 'list', query] as const,
};
