import { HearingSafetyPanel } from '@/features/safety/components/hearing-safety-panel';
import { useSessionPrep } from '../api/get-session-prep';
import { SessionPrepPanel } from './session-prep-panel';

/** What a booking with a room adds to the booking page: the prep checklist and the hearing-safety panel. */
export function BookingRoomPanels({ bookingId }: { bookingId: string }) {
  const prep = useSessionPrep(bookingId);
  // No room (404) → nothing to add; loading and other errors are shown by the checklist itself.
  const hasRoom = prep.isPending || !prep.error;
  if (!hasRoom) return null;
  return (
    <div className="mt-6 grid gap-6 lg:grid-cols-2">
      <SessionPrepPanel bookingId={bookingId} />
      <HearingSafetyPanel />
    </div>
  );
}
