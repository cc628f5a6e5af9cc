import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DisputeList } from '@shared/schemas/disputes';
import { api } from '@/lib/api-client';
import { disputeKeys } from './keys';

export function getBookingDisputes(bookingId: string, signal?: AbortSignal): Promise<DisputeList> {
  return api.get<DisputeList>(`/api/bookings/${encodeURIComponent(bookingId)}/disputes`, { signal });
}

export function bookingDisputesQueryOptions(bookingId: string) {
  return queryOptions({ queryKey: disputeKeys.forBooking(bookingId), queryFn: ({ signal }) => getBookingDisputes(bookingId, signal) });
}

export function useBookingDisputes(bookingId: string) {
  return useQuery(bookingDisputesQueryOptions(bookingId));
}
