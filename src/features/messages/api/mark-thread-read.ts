import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { unreadQueryOptions } from '@/features/notifications/api/get-unread';
import { threadsQueryOptions } from './get-threads';

export function markThreadRead(threadId: string): Promise<{ unread: number }> {
  return api.post(`/api/threads/${encodeURIComponent(threadId)}/read`);
}

export function useMarkThreadRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: markThreadRead,
    // A header poll already in flight would land after the read and bring the old count back.
    onMutate: () => queryClient.cancelQueries({ queryKey: unreadQueryOptions().queryKey }),
    onSuccess: ({ unread }) => {
      // The header badge drops at once instead of on its next poll.
      queryClient.setQueryData(unreadQueryOptions().queryKey, (old) => (old ? { ...old, messages: unread } : old));
      void queryClient.invalidateQueries({ queryKey: threadsQueryOptions().queryKey });
    },
  });
}
