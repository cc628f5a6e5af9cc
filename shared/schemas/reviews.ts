// Reviews (issue 4): after a booking is paid out the songwriter rates the drummer, and the engineer when
// there was one; one review per booking and person. Shown on profiles; ratings feed the search sort.
import { z } from 'zod';

export const REVIEW_SUBJECT_ROLES = ['drummer', 'engineer'] as const;
export type ReviewSubjectRole = (typeof REVIEW_SUBJECT_ROLES)[number];

export const createReviewInputSchema = z.strictObject({
  subjectRole: z.enum(REVIEW_SUBJECT_ROLES, 'Choose whom you review'),
  rating: z.number('Choose 1 to 5 stars').int('Whole stars').min(1, 'At least 1 star').max(5, 'At most 5 stars'),
  text: z.string().trim().min(10, 'Write at least 10 characters').max(2000, 'At most 2000 characters'),
});
export type CreateReviewInput = z.infer<typeof createReviewInputSchema>;

export const reviewsQuerySchema = z.strictObject({
  limit: z.coerce.number().int().min(1).max(50).default(20),
});
export type ReviewsQuery = z.infer<typeof reviewsQuerySchema>;

export type ReviewView = {
  id: string;
  bookingId: string;
  songTitle: string;
  subject: { id: string; displayName: string; role: ReviewSubjectRole };
  reviewer: { id: string; displayName: string };
  rating: number;
  text: string;
  createdAt: string;
};

/** A person's reviews as a profile shows them. */
export type ProfileReviews = { items: ReviewView[]; ratingAvg: number | null; ratingCount: number };

/** What the booking page needs: the reviews written and who can still be reviewed by the reader. */
export type BookingReviews = { items: ReviewView[]; canReview: ReviewSubjectRole[] };

/** The average shown and sorted on, to two decimals (stored the same way on the drummer profile). */
export function roundRating(sum: number, count: number): number | null {
  return count === 0 ? null : Math.round((sum / count) * 100) / 100;
}
