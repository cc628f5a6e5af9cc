import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { configKeys } from './keys';

/** What the server tells the client at boot. Only the mail inbox for now (set when running on the local fakes). */
export type PublicConfig = { mailInboxUrl: string | null };

export function parseConfig(body: unknown): PublicConfig {
  const inbox = (body as { mailInboxUrl?: unknown } | null)?.mailInboxUrl;
  // Only an http(s) address becomes a link; anything else is ignored rather than rendered.
  return { mailInboxUrl: typeof inbox === 'string' && /^https?:\/\//.test(inbox) ? inbox : null };
}

export async function getConfig(signal?: AbortSignal): Promise<PublicConfig> {
  return parseConfig(await api.get<unknown>('/api/config', { signal }));
}

export function configQueryOptions() {
  return queryOptions({
    queryKey: configKeys.all,
    queryFn: ({ signal }) => getConfig(signal),
    // Fixed for the life of the server process.
    staleTime: Infinity,
  });
}

export function useConfig() {
  return useQuery(configQueryOptions());
}
