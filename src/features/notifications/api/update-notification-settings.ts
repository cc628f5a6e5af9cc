import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { NotificationSettings, NotificationSettingsInput } from '@shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationSettingsQueryOptions } from './get-notification-settings';

export function updateNotificationSettings(input: NotificationSettingsInput): Promise<NotificationSettings> {
  return api.put('/api/notifications/settings', input);
}

export function useUpdateNotificationSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateNotificationSettings,
    onSuccess: (settings) => queryClient.setQueryData(notificationSettingsQueryOptions().queryKey, settings),
  });
}
