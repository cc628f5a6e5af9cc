import type { OpenBriefsQuery } from '@shared/schemas/briefs';

// Query keys of the briefs feature, general → specific; read through the queryOptions factories.
export const briefKeys = {
  all: ['briefs'] as const,
  mine: () => [...briefKeys.all, 'mine'] as const,
  open: (filters: OpenBriefsQuery) => [...briefKeys.all, 'open', filters] as const,
  detail: (id: string) => [...briefKeys.all, 'detail', id] as const,
  peaks: (id: string) => [...briefKeys.all, 'detail', id, 'peaks'] as const,
};
