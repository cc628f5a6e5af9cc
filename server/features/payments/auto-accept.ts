// The review-window clock (DESIGN.md, Money): a delivery left unanswered for MONEY_RULES.reviewWindowDays
// is accepted and released by a background job; an open dispute stops the clock. The delivery engineer
// calls scheduleAutoAccept when a delivery is ready, the dispute engineer cancelAutoAccept.
import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { autoAccepts, jobs } from '../../db/schema';
import { reviewWindowEndsAt } from '@shared/money';

export const AUTO_ACCEPT_JOB = 'payments.auto-accept';

/**
 * Starts (or restarts, for a later delivery) the clock inside the caller's transaction and queues the
 * job for the due time. The job row is written directly so this works inside any transaction; the runner
 * polls the table, so it is picked up without a kick.
 */
export function scheduleAutoAccept(tx: Db, bookingId: string, deliveredAt: Date, reviewWindowDays?: number): Date {
  const dueAt = reviewWindowEndsAt(deliveredAt, reviewWindowDays);
  const now = new Date();
  tx.insert(autoAccepts)
    .values({ bookingId, deliveredAt, dueAt, status: 'scheduled', updatedAt: now })
    .onConflictDoUpdate({ target: autoAccepts.bookingId, set: { deliveredAt, dueAt, status: 'scheduled', updatedAt: now } })
    .run();
  tx.insert(jobs)
    .values({ kind: AUTO_ACCEPT_JOB, payload: { bookingId, dueAt: dueAt.getTime() }, dedupeKey: `auto-accept:${bookingId}:${dueAt.getTime()}`, runAt: dueAt.getTime(), maxAttempts: 8, createdAt: now.getTime() })
    .onConflictDoNothing({ target: jobs.dedupeKey })
    .run();
  return dueAt;
}

/** Stops the clock (a dispute, or the songwriter answered); the queued job then finds nothing to do. */
export function cancelAutoAccept(tx: Db, bookingId: string): void {
  tx.update(autoAccepts).set({ status: 'cancelled', updatedAt: new Date() }).where(eq(autoAccepts.bookingId, bookingId)).run();
}

/** When the clock runs out, or null when it is not running. */
export function autoAcceptDate(tx: Db, bookingId: string): Date | null {
  const row = tx.select().from(autoAccepts).where(eq(autoAccepts.bookingId, bookingId)).get();
  return row?.status === 'scheduled' ? row.dueAt : null;
}

export function markAutoAcceptDone(tx: Db, bookingId: string): void {
  tx.update(autoAccepts).set({ status: 'done', updatedAt: new Date() }).where(eq(autoAccepts.bookingId, bookingId)).run();
}
