import { queryOptions, useQuery } from '@tanstack/react-query';
import { meSchema, type Me } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { authKeys } from './keys';

export async function getMe(signal?: AbortSignal): Promise<Me> {
  // Parsed with the shared schema so a server change shows up here as an error, not as undefined fields.
  return meSchema.parse(await api.get<unknown>('/api/me', { signal }));
}

export function meQueryOptions() {
  return queryOptions({
    queryKey: authKeys.me,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });
}

export function useMeQuery() {
  return useQuery(meQueryOptions());
}
