// Query keys of the notifications feature, general → specific; read through the queryOptions factories.
export const notificationKeys = {
  all: ['notifications'] as const,
  list: (limit: number) => [...notificationKeys.all, 'list', limit] as const,
  lists: () => [...notificationKeys.all, 'list'] as const,
  settings: () => [...notificationKeys.all, 'settings'] as const,
  /** The header's counts of unread messages and notifications. */
  unread: () => [...notificationKeys.all, 'unread'] as const,
};
