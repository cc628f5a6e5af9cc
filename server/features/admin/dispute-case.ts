// The dispute case file: the agreed terms, both conversations, the deliveries and their check reports, the
// booking's ledger and what admins already did. Read-only; assembled from the other features' own reads.
import type { Db } from '../../db/client';
import type { CurrentUser } from '../../auth/middleware';
import { createBookingsService } from '../bookings/bookings.service';
import { createMessagesRepository } from '../messages/messages.repository';
import { createLedger } from '../ledger/ledger.service';
import { createAuditService } from '../audit/audit.service';
import { readCaseDeliveries } from '../disputes/case-deliveries';
import type { DisputesService } from '../disputes/disputes.service';
import { createDisputesRepository } from '../disputes/disputes.repository';
import type { CaseMessage, DisputeCaseView } from '@shared/schemas/admin';

/** Enough of a long conversation to judge it; the case file says nothing is left out below this. */
const MESSAGES_PER_THREAD = 500;

export function createDisputeCase(deps: { db: Db; disputes: DisputesService }) {
  const { db, disputes } = deps;
  const bookings = createBookingsService({ db });
  const messages = createMessagesRepository(db);
  const ledger = createLedger(db);
  const audit = createAuditService({ db });
  const disputeRows = createDisputesRepository(db);

  function threadMessages(threadId: string | undefined, thread: CaseMessage['thread']): CaseMessage[] {
    if (!threadId) return [];
    return messages.messagesOf(threadId, { limit: MESSAGES_PER_THREAD }).map(({ message, senderName }) => ({
      id: message.id,
      thread,
      senderId: message.senderId,
      senderName,
      body: message.body,
      attachmentName: message.attachmentName,
      createdAt: message.createdAt.toISOString(),
    }));
  }

  return {
    get(admin: CurrentUser, disputeId: string): DisputeCaseView {
      const { dispute, booking } = disputes.get(admin, disputeId);
      const briefThread = messages.findBriefThread(booking.briefId, booking.drummerId);
      const bookingThread = messages.findBookingThread(booking.id);
      return {
        dispute,
        booking: bookings.toViews([booking], admin)[0],
        messages: [...threadMessages(briefThread?.id, 'brief'), ...threadMessages(bookingThread?.id, 'booking')],
        deliveries: readCaseDeliveries(db, booking.id),
        ledger: ledger.bookingLedger(booking.id),
        audit: [...audit.forTarget(admin, 'dispute', dispute.id), ...audit.forTarget(admin, 'booking', booking.id)],
        earlier: disputes.toViews(disputeRows.forBooking(booking.id).filter((d) => d.id !== dispute.id)),
      };
    },
  };
}
