import { useState } from 'react';
import { DISPUTABLE_STATUSES } from '@shared/schemas/disputes';
import type { BookingView } from '@shared/schemas/bookings';
import { Alert, Button, Card, Spinner } from '@/components/ui';
import { useBookingDisputes } from '../api/get-booking-disputes';
import { DisputeSummary } from './dispute-summary';
import { OpenDisputeForm } from './open-dispute-form';

const canOpen = (booking: BookingView) => booking.myRole !== 'admin' && (DISPUTABLE_STATUSES as readonly string[]).includes(booking.status);

/** The booking page's dispute section: past and open disputes, and the way to open one while money is held. */
export function BookingDisputes({ booking }: { booking: BookingView }) {
  const disputes = useBookingDisputes(booking.id);
  const [opening, setOpening] = useState(false);
  const items = disputes.data?.items ?? [];
  if (disputes.isPending) return <Spinner label="Loading disputes" />;
  if (disputes.error) return <Alert tone="error">The disputes of this booking could not be loaded: {disputes.error.message}</Alert>;
  if (items.length === 0 && !canOpen(booking)) return null;
  return (
    <Card className="space-y-4">
      <h2 className="text-xl font-bold">Dispute</h2>
      {items.map((d) => (
        <DisputeSummary key={d.id} dispute={d} />
      ))}
      {canOpen(booking) ? (
        opening ? (
          <OpenDisputeForm bookingId={booking.id} onDone={() => setOpening(false)} />
        ) : (
          <div className="space-y-2">
            <p className="text-ink-muted">If something went wrong that talking has not fixed, an admin can decide. Opening a dispute stops the release and the review-window clock.</p>
            <Button variant="secondary" onClick={() => setOpening(true)}>
              Open a dispute
            </Button>
          </div>
        )
      ) : null}
    </Card>
  );
}
