// Query keys of the quotes feature, general → specific; read through the queryOptions factories.
export const quoteKeys = {
  all: ['quotes'] as const,
  mine: () => [...quoteKeys.all, 'mine'] as const,
  engineerRequests: () => [...quoteKeys.all, 'engineer-requests'] as const,
  forBrief: (briefId: string) => [...quoteKeys.all, 'brief', briefId] as const,
  detail: (id: string) => [...quoteKeys.all, 'detail', id] as const,
};
