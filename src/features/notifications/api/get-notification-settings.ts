import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NotificationSettings } from '@shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationKeys } from './keys';

export function getNotificationSettings(signal?: AbortSignal): Promise<NotificationSettings> {
  return api.get('/api/notifications/settings', { signal });
}

export function notificationSettingsQueryOptions() {
  return queryOptions({ queryKey: notificationKeys.settings(), queryFn: ({ signal }) => getNotificationSettings(signal) });
}

export function useNotificationSettings() {
  return useQuery(notificationSettingsQueryOptions());
}
