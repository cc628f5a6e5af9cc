// Query keys of the rooms feature, general → specific; read through the queryOptions factories.
export const roomKeys = {
  all: ['rooms'] as const,
  search: (filters: Record<string, string>) => [...roomKeys.all, 'search', filters] as const,
  mine: () => [...roomKeys.all, 'mine'] as const,
  detail: (id: string) => [...roomKeys.all, 'detail', id] as const,
  acoustics: (id: string) => [...roomKeys.all, 'acoustics', id] as const,
};
