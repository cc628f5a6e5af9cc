import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PublicDrummer } from '@shared/schemas/profiles';
import { api } from '@/lib/api-client';
import { profileKeys } from './keys';

export async function getDrummer(id: string, signal?: AbortSignal): Promise<PublicDrummer> {
  const res = await api.get<{ drummer: PublicDrummer }>(`/api/drummers/${encodeURIComponent(id)}`, { signal });
  return res.drummer;
}

export function drummerQueryOptions(id: string) {
  return queryOptions({ queryKey: profileKeys.drummer(id), queryFn: ({ signal }) => getDrummer(id, signal) });
}

export function useDrummer(id: string) {
  return useQuery(drummerQueryOptions(id));
}
