import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BookingReviews } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { reviewKeys } from './keys';

export function getBookingReviews(bookingId: string, signal?: AbortSignal): Promise<BookingReviews> {
  return api.get<BookingReviews>(`/api/bookings/${encodeURIComponent(bookingId)}/reviews`, { signal });
}

export function bookingReviewsQueryOptions(bookingId: string) {
  return queryOptions({ queryKey: reviewKeys.forBooking(bookingId), queryFn: ({ signal }) => getBookingReviews(bookingId, signal) });
}

export function useBookingReviews(bookingId: string) {
  return useQuery(bookingReviewsQueryOptions(bookingId));
}
