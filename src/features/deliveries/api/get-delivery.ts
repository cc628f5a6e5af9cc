import { queryOptions, useQuery } from '@tanstack/react-query';
import { deliveryPaths, type DeliveryView } from '@shared/schemas/deliveries';
import { api } from '@/lib/api-client';
import { deliveryKeys } from './keys';

export async function getDelivery(id: string, signal?: AbortSignal): Promise<DeliveryView> {
  return (await api.get<{ delivery: DeliveryView }>(deliveryPaths.one(id), { signal })).delivery;
}

/** Polls while the check or the previews are still being made, so progress shows without a reload. */
export function deliveryQueryOptions(id: string) {
  return queryOptions({
    queryKey: deliveryKeys.detail(id),
    queryFn: ({ signal }) => getDelivery(id, signal),
    refetchInterval: (query) => (query.state.data?.status === 'checking' ? 750 : false),
  });
}

export function useDelivery(id: string) {
  return useQuery(deliveryQueryOptions(id));
}
