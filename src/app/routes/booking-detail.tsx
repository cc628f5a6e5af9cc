import { Link, useParams } from 'react-router-dom';
import { formatMoney } from '@shared/money';
import { paths } from '@/config/paths';
import { Alert, PageHeader } from '@/components/ui';
import { useBooking } from '@/features/bookings/api/get-booking';
import { BookingStatusBadge } from '@/features/bookings/components/booking-status-badge';
import { BookingTerms } from '@/features/bookings/components/booking-terms';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';
import { EscrowPanel } from '@/features/payments/components/escrow-panel';
import { BookingDisputes } from '@/features/disputes/components/booking-disputes';
import { BookingReviews } from '@/features/reviews/components/booking-reviews';
import { DeliveriesPanel } from '@/features/deliveries/components/deliveries-panel';
import { BookingRoomPanels } from '@/features/session-prep/components/booking-room-panels';
import { OpenThreadButton } from '@/features/messages/components/open-thread-button';

export function Component() {
  const { bookingId = '' } = useParams();
  const booking = useBooking(bookingId);
  useDocumentTitle(booking.data ? `Booking: ${booking.data.terms.songTitle}` : 'Booking');
  return (
    <QueryState isPending={booking.isPending} error={booking.error} retry={() => void booking.refetch()} loadingLabel="Loading the booking">
      {() => {
        const b = booking.data!;
        return (
          <>
            <PageHeader
              title={b.terms.songTitle}
              description={
                <span className="flex flex-wrap items-center gap-2">
                  <BookingStatusBadge status={b.status} />
                  <span>
                    {b.songwriter.displayName} hired {b.drummer.displayName}
                    {b.engineer ? ` with ${b.engineer.displayName}` : ''} for {formatMoney(b.totalMinor, b.currency)} ·{' '}
                    <Link to={paths.brief.getHref(b.briefId)} className="underline">
                      the brief
                    </Link>
                  </span>
                </span>
              }
              actions={b.myRole !== 'admin' ? <OpenThreadButton target={{ bookingId: b.id }}>Message about this booking</OpenThreadButton> : undefined}
            />
            {b.status === 'awaiting_payment' ? (
              <Alert tone="info" className="mb-6">
                {b.myRole === 'songwriter'
                  ? 'Next: pay the agreed total into escrow. The drummer starts once the payment is held.'
                  : 'Waiting for the songwriter to pay into escrow. You will be told when the booking is funded.'}
              </Alert>
            ) : null}
            <EscrowPanel bookingId={b.id} />
            <div className="mb-6 space-y-6 empty:hidden">
              <BookingDisputes booking={b} />
              <BookingReviews booking={b} />
            </div>
            <DeliveriesPanel bookingId={b.id} />
            <BookingTerms booking={b} />
            <BookingRoomPanels bookingId={b.id} />
          </>
        );
      }}
    </QueryState>
  );
}
