import { queryOptions, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { MessageView, ThreadMessages } from '@shared/schemas/messages';
import { api } from '@/lib/api-client';
import { messageKeys } from './keys';

/** The open conversation asks for new messages this often. */
export const THREAD_POLL_MS = 3_000;

export function getThreadMessages(threadId: string, after?: string, signal?: AbortSignal): Promise<ThreadMessages> {
  const query = after ? `?after=${encodeURIComponent(after)}` : '';
  return api.get(`/api/threads/${encodeURIComponent(threadId)}/messages${query}`, { signal });
}

/** Adds new messages to the ones already shown, once each, oldest first. */
export function mergeMessages(known: MessageView[], incoming: MessageView[]): MessageView[] {
  if (incoming.length === 0) return known;
  const byId = new Map(known.map((m) => [m.id, m]));
  for (const m of incoming) byId.set(m.id, m);
  return [...byId.values()].sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.id.localeCompare(b.id));
}

/**
 * The first fetch loads the latest page; every poll after it asks only for what is newer than the last
 * message held (`?after=`), so a long conversation is not downloaded again every three seconds.
 */
export function threadMessagesQueryOptions(queryClient: QueryClient, threadId: string) {
  const queryKey = messageKeys.thread(threadId);
  return queryOptions({
    queryKey,
    queryFn: async ({ signal }): Promise<ThreadMessages> => {
      const held = queryClient.getQueryData<ThreadMessages>(queryKey);
      const after = held?.messages.at(-1)?.createdAt;
      const page = await getThreadMessages(threadId, after, signal);
      return held && after ? { thread: page.thread, messages: mergeMessages(held.messages, page.messages) } : page;
    },
    refetchInterval: THREAD_POLL_MS,
  });
}

export function useThreadMessages(threadId: string) {
  const queryClient = useQueryClient();
  return useQuery(threadMessagesQueryOptions(queryClient, threadId));
}
