import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NotificationList } from '@shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationKeys } from './keys';

export function getNotifications(limit: number, signal?: AbortSignal): Promise<NotificationList> {
  return api.get(`/api/notifications?limit=${limit}`, { signal });
}

export function notificationsQueryOptions(limit = 30) {
  return queryOptions({
    queryKey: notificationKeys.list(limit),
    queryFn: ({ signal }) => getNotifications(limit, signal),
    staleTime: 5_000,
  });
}

export function useNotifications(limit = 30, opts: { enabled?: boolean } = {}) {
  return useQuery({ ...notificationsQueryOptions(limit), enabled: opts.enabled ?? true });
}
