// Query keys of the messages feature, general → specific; read through the queryOptions factories.
export const messageKeys = {
  all: ['messages'] as const,
  threads: () => [...messageKeys.all, 'threads'] as const,
  thread: (id: string) => [...messageKeys.all, 'thread', id] as const,
};
