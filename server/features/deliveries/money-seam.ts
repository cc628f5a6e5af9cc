// The one place the delivery feature meets the money feature (issue 4): accepting releases the escrow,
// a request for changes is counted (and may need an add-on payment before work goes on), and submitting
// starts the review-window clock.
import { eq } from 'drizzle-orm';
import type { AppContext } from '../../app';
import type { CurrentUser } from '../../auth/middleware';
import type { Db } from '../../db/client';
import { bookingMoney } from '../../db/schema';
import { escrowFor } from '../payments/escrow.service';
import { recordChangeRequest } from '../payments/escrow.service';
import { cancelAutoAccept, scheduleAutoAccept } from '../payments/auto-accept';

export type MoneySeam = {
  releaseBooking(actor: CurrentUser, bookingId: string, input: { reason: string }): Promise<unknown>;
  needsAddOnPayment(bookingId: string): boolean;
  /** Inside the caller's transaction. */
  scheduleAutoAccept(tx: Db, bookingId: string, deliveredAt: Date): void;
  stopAutoAccept(tx: Db, bookingId: string): void;
  recordChangeRequest(tx: Db, bookingId: string): { addOnsOutstanding: number };
  /** How the held money was decided: 'release' and 'split' give the songwriter the originals. */
  outcome(tx: Db, bookingId: string): 'release' | 'refund' | 'split' | null;
};

export function moneySeam(ctx: AppContext): MoneySeam {
  const escrow = escrowFor(ctx);
  return {
    releaseBooking: (actor, bookingId, input) => escrow.releaseBooking(actor, bookingId, input),
    needsAddOnPayment: (bookingId) => escrow.needsAddOnPayment(bookingId),
    scheduleAutoAccept: (tx, bookingId, deliveredAt) => {
      scheduleAutoAccept(tx, bookingId, deliveredAt);
    },
    stopAutoAccept: (tx, bookingId) => cancelAutoAccept(tx, bookingId),
    recordChangeRequest: (tx, bookingId) => recordChangeRequest(tx, bookingId),
    // Read without creating the money row (the money feature's repository creates it on first read).
    outcome: (tx, bookingId) => tx.select({ outcome: bookingMoney.outcome }).from(bookingMoney).where(eq(bookingMoney.bookingId, bookingId)).get()?.outcome ?? null,
  };
}
