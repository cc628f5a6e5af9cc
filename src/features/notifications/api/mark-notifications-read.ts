import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MarkNotificationsReadInput } from '@shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationKeys } from './keys';
import { unreadQueryOptions } from './get-unread';

/** One notification (`id`) or, without it, all of them. */
export function markNotificationsRead(input: MarkNotificationsReadInput): Promise<{ unread: number }> {
  return api.post('/api/notifications/read', input);
}

export function useMarkNotificationsRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: markNotificationsRead,
    onSuccess: ({ unread }) => {
      queryClient.setQueryData(unreadQueryOptions().queryKey, (old) => (old ? { ...old, notifications: unread } : old));
      void queryClient.invalidateQueries({ queryKey: notificationKeys.lists() });
    },
  });
}
