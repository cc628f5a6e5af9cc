import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DisputeCaseView } from '@shared/schemas/admin';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

export async function getDisputeCase(id: string, signal?: AbortSignal): Promise<DisputeCaseView> {
  return (await api.get<{ case: DisputeCaseView }>(`/api/admin/disputes/${encodeURIComponent(id)}`, { signal })).case;
}

export function disputeCaseQueryOptions(id: string) {
  return queryOptions({ queryKey: adminKeys.disputeCase(id), queryFn: ({ signal }) => getDisputeCase(id, signal) });
}

export function useDisputeCase(id: string) {
  return useQuery(disputeCaseQueryOptions(id));
}
