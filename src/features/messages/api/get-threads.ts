import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ThreadSummary } from '@shared/schemas/messages';
import { api } from '@/lib/api-client';
import { messageKeys } from './keys';

export const THREADS_POLL_MS = 10_000;

export function getThreads(signal?: AbortSignal): Promise<{ items: ThreadSummary[] }> {
  return api.get('/api/threads', { signal });
}

export function threadsQueryOptions() {
  return queryOptions({
    queryKey: messageKeys.threads(),
    queryFn: ({ signal }) => getThreads(signal),
    refetchInterval: THREADS_POLL_MS,
    staleTime: 2_000,
  });
}

export function useThreads() {
  return useQuery(threadsQueryOptions());
}
