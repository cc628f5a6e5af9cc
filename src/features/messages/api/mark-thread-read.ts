import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { unreadQueryOptions } from '@/features/notifications/api/get-unread';
import { threadsQueryOptions } from './get-threads';

export function markThreadRead(threadId: string): Promise<{ unread: number }> {
  return api.post(`/api/threads/${encodeURIComponent(threadId)}/read`);
}

/**
 * The header's unread poll runs on its own clock, so one can be in flight on either side of the read:
 * started before the request (cancelled at once) or while it is on the wire, when the server may have
 * counted before it stored the read. Either would land after the read and bring the old count back until
 * the next poll, 10 s later. The count the read answers with is the newest there is, so both are dropped.
 */
export function markThreadReadOptions(queryClient: QueryClient) {
  const unreadKey = unreadQueryOptions().queryKey;
  return {
    mutationFn: markThreadRead,
    onMutate: () => queryClient.cancelQueries({ queryKey: unreadKey }),
    onSuccess: async ({ unread }: { unread: number }) => {
      await queryClient.cancelQueries({ queryKey: unreadKey });
      const held = queryClient.getQueryData(unreadKey);
      // The header badge drops at once instead of on its next poll; without counts yet (the first poll was
      // the one dropped) it asks again, now that the read is stored.
      if (held) queryClient.setQueryData(unreadKey, { ...held, messages: unread });
      else void queryClient.invalidateQueries({ queryKey: unreadKey });
      void queryClient.invalidateQueries({ queryKey: threadsQueryOptions().queryKey });
    },
  };
}

export function useMarkThreadRead() {
  const queryClient = useQueryClient();
  return useMutation(markThreadReadOptions(queryClient));
}
