import { BOOKING_STATUS_LABELS, type BookingStatus } from '@shared/schemas/bookings';
import { Badge } from '@/components/ui';

const TONE: Partial<Record<BookingStatus, 'neutral' | 'brand' | 'accent' | 'success' | 'danger'>> = {
  awaiting_payment: 'accent',
  funded: 'brand',
  recording: 'brand',
  delivered: 'brand',
  changes_requested: 'accent',
  accepted: 'success',
  paid_out: 'success',
  disputed: 'danger',
  cancelled: 'neutral',
};

export function BookingStatusBadge({ status }: { status: BookingStatus }) {
  return (
    <Badge tone={TONE[status] ?? 'neutral'}>
      <span data-testid="booking-status" data-status={status}>
        {BOOKING_STATUS_LABELS[status]}
      </span>
    </Badge>
  );
}
