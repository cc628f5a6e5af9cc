import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BookingView } from '@shared/schemas/bookings';
import { api } from '@/lib/api-client';
import { bookingKeys } from './keys';

export async function getBooking(id: string, signal?: AbortSignal): Promise<BookingView> {
  return (await api.get<{ booking: BookingView }>(`/api/bookings/${encodeURIComponent(id)}`, { signal })).booking;
}

export function bookingQueryOptions(id: string) {
  return queryOptions({ queryKey: bookingKeys.detail(id), queryFn: ({ signal }) => getBooking(id, signal) });
}

export function useBooking(id: string) {
  return useQuery(bookingQueryOptions(id));
}
