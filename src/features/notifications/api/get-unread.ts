import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UnreadCounts } from '@shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationKeys } from './keys';

/** How often the header asks for new counts: new messages show up without a reload (issue 3). */
export const UNREAD_POLL_MS = 10_000;

export function getUnread(signal?: AbortSignal): Promise<UnreadCounts> {
  return api.get('/api/unread', { signal });
}

export function unreadQueryOptions() {
  return queryOptions({
    queryKey: notificationKeys.unread(),
    queryFn: ({ signal }) => getUnread(signal),
    refetchInterval: UNREAD_POLL_MS,
    staleTime: 2_000,
  });
}

export function useUnread() {
  return useQuery(unreadQueryOptions());
}
