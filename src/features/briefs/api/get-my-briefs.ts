import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BriefListItem } from '@shared/schemas/briefs';
import { api } from '@/lib/api-client';
import { briefKeys } from './keys';

export type MyBriefs = { items: BriefListItem[]; total: number };

export function getMyBriefs(signal?: AbortSignal): Promise<MyBriefs> {
  return api.get('/api/briefs/mine', { signal });
}

export function myBriefsQueryOptions() {
  return queryOptions({ queryKey: briefKeys.mine(), queryFn: ({ signal }) => getMyBriefs(signal) });
}

export function useMyBriefs() {
  return useQuery(myBriefsQueryOptions());
}
