import { queryOptions, useQuery } from '@tanstack/react-query';
import { deliveryPaths, type DeliveryListView } from '@shared/schemas/deliveries';
import { api } from '@/lib/api-client';
import { deliveryKeys } from './keys';

export function getBookingDeliveries(bookingId: string, signal?: AbortSignal): Promise<DeliveryListView> {
  return api.get<DeliveryListView>(deliveryPaths.list(bookingId), { signal });
}

export function bookingDeliveriesQueryOptions(bookingId: string) {
  return queryOptions({ queryKey: deliveryKeys.forBooking(bookingId), queryFn: ({ signal }) => getBookingDeliveries(bookingId, signal) });
}

export function useBookingDeliveries(bookingId: string) {
  return useQuery(bookingDeliveriesQueryOptions(bookingId));
}
