import { HearingSafetyPanel } from '@/features/safety/components/hearing-safety-panel';
import { useSessionPrep } from '../api/get-session-prep';
import { SessionPrepPanel } from './session-prep-panel';

/** What a booking with a room adds to the booking page: the prep checklist and the hearing-safety panel. */
export function BookingRoomPanels({ bookingId }: { bookingId: string }) {
  const prep = useSessionPrep(bookingId);
  // No room (prep is null) → nothing to add; errors are shown by the checklist itself.
  if (prep.isPending || prep.data === null) return null;
  return (
    <div className="mt-6 grid gap-6 lg:grid-cols-2">
      <SessionPrepPanel bookingId={bookingId} />
      <HearingSafetyPanel />
    </div>
  );
}
