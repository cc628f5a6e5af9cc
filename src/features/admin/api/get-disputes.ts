import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DisputeList } from '@shared/schemas/disputes';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

export function getDisputes(status: 'open' | 'settled' | undefined, signal?: AbortSignal): Promise<DisputeList> {
  return api.get<DisputeList>(`/api/admin/disputes${status ? `?status=${status}` : ''}`, { signal });
}

export function disputesQueryOptions(status: 'open' | 'settled' | undefined) {
  return queryOptions({ queryKey: adminKeys.disputes(status), queryFn: ({ signal }) => getDisputes(status, signal) });
}

export function useDisputes(status: 'open' | 'settled' | undefined) {
  return useQuery(disputesQueryOptions(status));
}
