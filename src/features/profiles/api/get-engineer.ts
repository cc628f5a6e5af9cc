import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PublicEngineer } from '@shared/schemas/profiles';
import { api } from '@/lib/api-client';
import { profileKeys } from './keys';

export async function getEngineer(id: string, signal?: AbortSignal): Promise<PublicEngineer> {
  const res = await api.get<{ engineer: PublicEngineer }>(`/api/engineers/${encodeURIComponent(id)}`, { signal });
  return res.engineer;
}

export function engineerQueryOptions(id: string) {
  return queryOptions({ queryKey: profileKeys.engineer(id), queryFn: ({ signal }) => getEngineer(id, signal) });
}

export function useEngineer(id: string) {
  return useQuery(engineerQueryOptions(id));
}
