import { afterEach, describe, expect, it, vi } from 'vitest';
import { MutationObserver, QueryClient, QueryObserver } from '@tanstack/react-query';
import type { UnreadCounts } from '@shared/schemas/notifications';
import { unreadQueryOptions } from '@/features/notifications/api/get-unread';
import { markThreadReadOptions } from './mark-thread-read';

type Pending = { method: string; path: string; answer(body: unknown): void };

/** A fetch whose every answer the test gives by hand, in the order it chooses; aborts reject as fetch does. */
function handAnsweredFetch() {
  const pending: Pending[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(
      (path: string, init: RequestInit = {}) =>
        new Promise<Response>((resolve, reject) => {
          init.signal?.addEventListener('abort', () => reject(new DOMException('aborted', 'AbortError')));
          const answer = (body: unknown) => resolve(new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } }));
          pending.push({ method: init.method ?? 'GET', path, answer });
        }),
    ),
  );
  /** Waits for the next unanswered request to `path` and hands it over. */
  const next = async (method: string, path: string): Promise<Pending> => {
    let found: Pending | undefined;
    await vi.waitFor(() => {
      found = pending.find((p) => p.method === method && p.path === path);
      if (!found) throw new Error(`no ${method} ${path} yet`);
    });
    pending.splice(pending.indexOf(found!), 1);
    return found!;
  };
  return { next };
}

const testQueryClient = () => new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
const unreadKey = unreadQueryOptions().queryKey;
const unreadOf = (queryClient: QueryClient) => queryClient.getQueryData<UnreadCounts>(unreadKey);

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('marking a thread read', () => {
  it('keeps the count the read answered when an unread poll sent during the read lands after it', async () => {
    const server = handAnsweredFetch();
    const queryClient = testQueryClient();
    const loaded = queryClient.fetchQuery(unreadQueryOptions());
    (await server.next('GET', '/api/unread')).answer({ messages: 2, notifications: 5 });
    await loaded;

    const read = new MutationObserver(queryClient, markThreadReadOptions(queryClient)).mutate('t1');
    const post = await server.next('POST', '/api/threads/t1/read');
    // The header's poll fires while the read is on the wire; the server counts before the read is stored.
    const poll = queryClient.fetchQuery({ ...unreadQueryOptions(), staleTime: 0 }).catch(() => undefined);
    const stalePoll = await server.next('GET', '/api/unread');
    post.answer({ unread: 1 });
    await read;
    stalePoll.answer({ messages: 2, notifications: 5 });

    await poll;
    expect(unreadOf(queryClient)).toEqual({ messages: 1, notifications: 5 });
  });

  it('asks for the counts again after the read when the header had none yet', async () => {
    const server = handAnsweredFetch();
    const queryClient = testQueryClient();
    const header = new QueryObserver(queryClient, unreadQueryOptions());
    const stop = header.subscribe(() => {});
    try {
      // The header's first poll is still out when the thread is opened, so the read drops it.
      await server.next('GET', '/api/unread');
      const read = new MutationObserver(queryClient, markThreadReadOptions(queryClient)).mutate('t1');
      (await server.next('POST', '/api/threads/t1/read')).answer({ unread: 0 });
      await read;

      (await server.next('GET', '/api/unread')).answer({ messages: 0, notifications: 3 });
      await vi.waitFor(() => expect(unreadOf(queryClient)).toEqual({ messages: 0, notifications: 3 }));
    } finally {
      stop();
    }
  });
});
