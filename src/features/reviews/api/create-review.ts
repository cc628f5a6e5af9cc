import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateReviewInput, ReviewView } from '@shared/schemas/reviews';
import { api } from '@/lib/api-client';
import { reviewKeys } from './keys';

export async function createReview(bookingId: string, input: CreateReviewInput): Promise<ReviewView> {
  return (await api.post<{ review: ReviewView }>(`/api/bookings/${encodeURIComponent(bookingId)}/reviews`, input)).review;
}

/** A new review changes the booking's list and the reviewed person's profile figures. */
export function useCreateReview(bookingId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateReviewInput) => createReview(bookingId, input),
    onSuccess: (review) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: reviewKeys.forBooking(bookingId) }),
        queryClient.invalidateQueries({ queryKey: reviewKeys.forProfile(review.subject.role, review.subject.id) }),
      ]),
  });
}
