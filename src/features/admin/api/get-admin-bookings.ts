import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { AdminBookingList } from '@shared/schemas/admin';
import { api } from '@/lib/api-client';
import { adminKeys } from './keys';

export const BOOKING_LIST_LIMIT = 200;

export function getAdminBookings(q: string, status: string, signal?: AbortSignal): Promise<AdminBookingList> {
  const params = new URLSearchParams({ limit: String(BOOKING_LIST_LIMIT) });
  if (q) params.set('q', q);
  if (status) params.set('status', status);
  return api.get<AdminBookingList>(`/api/admin/bookings?${params}`, { signal });
}

export function adminBookingsQueryOptions(q: string, status: string) {
  return queryOptions({ queryKey: adminKeys.bookings(q, status), queryFn: ({ signal }) => getAdminBookings(q, status, signal), placeholderData: keepPreviousData });
}

export function useAdminBookings(q: string, status: string) {
  return useQuery(adminBookingsQueryOptions(q, status));
}
