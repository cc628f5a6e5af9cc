// Wiring: the disputes service on the app's context, with the escrow service's outcome functions.
import { eq } from 'drizzle-orm';
import type { AppContext } from '../../app';
import { bookingMoney } from '../../db/schema';
import { escrowFor } from '../payments/escrow.service';
import { createDisputesService, type DisputesService, type EscrowOutcomes } from './disputes.service';

function escrowOutcomes(ctx: AppContext): EscrowOutcomes {
  const escrow = escrowFor(ctx);
  return {
    releaseBooking: (actor, bookingId, input) => escrow.releaseBooking(actor, bookingId, input),
    refundBooking: (actor, bookingId, input) => escrow.refundBooking(actor, bookingId, input),
    splitBooking: (actor, bookingId, input) => escrow.splitBooking(actor, bookingId, input),
    // Read without creating the row: a booking that never had money facts has no outcome.
    outcomeOf: (bookingId) => ctx.db.select({ outcome: bookingMoney.outcome }).from(bookingMoney).where(eq(bookingMoney.bookingId, bookingId)).get()?.outcome ?? null,
  };
}

const services = new WeakMap<AppContext, DisputesService>();

/** One disputes service per app (its repair job is registered once), shared by routes, seed and tests. */
export function disputesFor(ctx: AppContext): DisputesService {
  let service = services.get(ctx);
  if (!service) {
    service = createDisputesService({ db: ctx.db, notifications: ctx.notifications, jobs: ctx.jobs, escrow: escrowOutcomes(ctx), logger: ctx.logger });
    services.set(ctx, service);
  }
  return service;
}
