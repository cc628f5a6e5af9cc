import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BriefView } from '@shared/schemas/briefs';
import { api } from '@/lib/api-client';
import { briefKeys } from './keys';

export async function getBrief(id: string, signal?: AbortSignal): Promise<BriefView> {
  return (await api.get<{ brief: BriefView }>(`/api/briefs/${encodeURIComponent(id)}`, { signal })).brief;
}

export function briefQueryOptions(id: string) {
  return queryOptions({ queryKey: briefKeys.detail(id), queryFn: ({ signal }) => getBrief(id, signal) });
}

export function useBrief(id: string) {
  return useQuery(briefQueryOptions(id));
}
