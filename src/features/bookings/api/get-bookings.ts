import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BookingList } from '@shared/schemas/bookings';
import { api } from '@/lib/api-client';
import { bookingKeys } from './keys';

export function getBookings(all: boolean, signal?: AbortSignal): Promise<BookingList> {
  return api.get(`/api/bookings${all ? '?all=1' : ''}`, { signal });
}

export function bookingsQueryOptions(all = false) {
  return queryOptions({ queryKey: bookingKeys.list(all), queryFn: ({ signal }) => getBookings(all, signal) });
}

export function useBookings(all = false) {
  return useQuery(bookingsQueryOptions(all));
}
