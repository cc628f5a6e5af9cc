import type { BookingView } from '@shared/schemas/bookings';
import { Alert, Card, Spinner } from '@/components/ui';
import { useBookingReviews } from '../api/get-booking-reviews';
import { ReviewForm } from './review-form';
import { ReviewList } from './review-list';

/** The booking page's review section, shown once the booking is paid out. */
export function BookingReviews({ booking }: { booking: BookingView }) {
  const reviews = useBookingReviews(booking.id);
  if (booking.status !== 'paid_out') return null;
  if (reviews.isPending) return <Spinner label="Loading reviews" />;
  if (reviews.error) return <Alert tone="error">Reviews could not be loaded: {reviews.error.message}</Alert>;
  const { items, canReview } = reviews.data;
  if (items.length === 0 && canReview.length === 0) return null;
  const nameOf = (role: 'drummer' | 'engineer') => (role === 'drummer' ? booking.drummer.displayName : (booking.engineer?.displayName ?? 'the engineer'));
  return (
    <Card className="space-y-5">
      <h2 className="text-xl font-bold">Reviews</h2>
      {items.length > 0 ? <ReviewList reviews={items} showSubject /> : null}
      {canReview.map((role) => (
        <ReviewForm key={role} bookingId={booking.id} subjectRole={role} subjectName={nameOf(role)} />
      ))}
    </Card>
  );
}
