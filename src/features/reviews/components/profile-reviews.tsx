import type { ReviewSubjectRole } from '@shared/schemas/reviews';
import { Alert, Card, EmptyState, Spinner } from '@/components/ui';
import { useProfileReviews } from '../api/get-profile-reviews';
import { ReviewList } from './review-list';
import { Stars } from './stars';

/** Reviews on a drummer's or engineer's public profile. */
export function ProfileReviews({ role, personId }: { role: ReviewSubjectRole; personId: string }) {
  const reviews = useProfileReviews(role, personId);
  if (reviews.isPending) return <Spinner label="Loading reviews" />;
  if (reviews.error) return <Alert tone="error">Reviews could not be loaded: {reviews.error.message}</Alert>;
  const { items, ratingAvg, ratingCount } = reviews.data;
  return (
    <Card className="space-y-4">
      <h2 className="flex flex-wrap items-center gap-2 text-xl font-bold">
        Reviews
        {ratingAvg !== null ? (
          <span className="flex items-center gap-2 text-base font-normal">
            <Stars rating={ratingAvg} /> {ratingAvg.toFixed(2)} from {ratingCount} {ratingCount === 1 ? 'review' : 'reviews'}
          </span>
        ) : null}
      </h2>
      {items.length === 0 ? <EmptyState title="No reviews yet">Songwriters review after a booking is paid out.</EmptyState> : <ReviewList reviews={items} />}
    </Card>
  );
}
