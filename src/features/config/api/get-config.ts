import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { configKeys } from './keys';

// What the server tells the client at boot. Only the mail inbox for now (set when running on the local fakes).
const publicConfigSchema = z.object({ mailInboxUrl: z.string().nullable().optional() });
export type PublicConfig = { mailInboxUrl: string | null };

export async function getConfig(signal?: AbortSignal): Promise<PublicConfig> {
  const parsed = publicConfigSchema.parse(await api.get<unknown>('/api/config', { signal }));
  return { mailInboxUrl: parsed.mailInboxUrl ?? null };
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
