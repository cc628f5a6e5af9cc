import { and, asc, desc, eq, inArray, ne } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { autoAccepts, bookingMoney, bookingPayments, bookings, moneyIntents, payoutAccounts, processedEvents, users } from '../../db/schema';

export type BookingRow = typeof bookings.$inferSelect;
export type PaymentRow = typeof bookingPayments.$inferSelect;
export type IntentRow = typeof moneyIntents.$inferSelect;
export type PayoutAccountRow = typeof payoutAccounts.$inferSelect;
export type BookingMoneyRow = typeof bookingMoney.$inferSelect;
export type AutoAcceptRow = typeof autoAccepts.$inferSelect;

// Plain queries on the money tables. Every function takes the db or a transaction handle first.
export const paymentsRepo = {
  booking(tx: Db, id: string): BookingRow | undefined {
    return tx.select().from(bookings).where(eq(bookings.id, id)).get();
  },

  moneyOf(tx: Db, bookingId: string): BookingMoneyRow {
    const row = tx.select().from(bookingMoney).where(eq(bookingMoney.bookingId, bookingId)).get();
    if (row) return row;
    return tx.insert(bookingMoney).values({ bookingId, cancelRequestedBy: [], updatedAt: new Date() }).returning().get();
  },

  updateMoney(tx: Db, bookingId: string, set: Partial<Omit<BookingMoneyRow, 'bookingId'>>): void {
    paymentsRepo.moneyOf(tx, bookingId);
    tx.update(bookingMoney).set({ ...set, updatedAt: new Date() }).where(eq(bookingMoney.bookingId, bookingId)).run();
  },

  payments(tx: Db, bookingId: string): PaymentRow[] {
    return tx.select().from(bookingPayments).where(eq(bookingPayments.bookingId, bookingId)).orderBy(asc(bookingPayments.createdAt), asc(bookingPayments.id)).all();
  },

  payment(tx: Db, id: string): PaymentRow | undefined {
    return tx.select().from(bookingPayments).where(eq(bookingPayments.id, id)).get();
  },

  paymentBySession(tx: Db, sessionId: string): PaymentRow | undefined {
    return tx.select().from(bookingPayments).where(eq(bookingPayments.sessionId, sessionId)).get();
  },

  /** Paid charges of a booking, newest first, with what is left of each to refund or transfer. */
  chargeRoom(tx: Db, bookingId: string): { chargeId: string; roomMinor: number }[] {
    return tx
      .select()
      .from(bookingPayments)
      .where(and(eq(bookingPayments.bookingId, bookingId), eq(bookingPayments.status, 'paid')))
      .orderBy(desc(bookingPayments.paidAt), desc(bookingPayments.id))
      .all()
      .filter((p) => p.chargeId)
      .map((p) => ({ chargeId: p.chargeId!, roomMinor: p.amountMinor - p.refundedMinor - p.transferredMinor }));
  },

  commitAgainstCharge(tx: Db, chargeId: string, kind: 'transfer' | 'refund', amountMinor: number): void {
    const row = tx.select().from(bookingPayments).where(eq(bookingPayments.chargeId, chargeId)).get();
    if (!row) throw new Error(`no payment for charge ${chargeId}`);
    tx.update(bookingPayments)
      .set(kind === 'refund' ? { refundedMinor: row.refundedMinor + amountMinor } : { transferredMinor: row.transferredMinor + amountMinor })
      .where(eq(bookingPayments.id, row.id))
      .run();
  },

  intents(tx: Db, bookingId: string): IntentRow[] {
    return tx.select().from(moneyIntents).where(eq(moneyIntents.bookingId, bookingId)).orderBy(asc(moneyIntents.createdAt), asc(moneyIntents.id)).all();
  },

  intent(tx: Db, id: string): IntentRow | undefined {
    return tx.select().from(moneyIntents).where(eq(moneyIntents.id, id)).get();
  },

  /** Intents a job should (re)try: pending ones, and waiting ones whose payee may have finished onboarding. */
  openIntents(tx: Db): IntentRow[] {
    return tx.select().from(moneyIntents).where(inArray(moneyIntents.status, ['pending', 'waiting_account'])).orderBy(asc(moneyIntents.createdAt)).all();
  },

  waitingFor(tx: Db, payeeId: string): IntentRow[] {
    return tx.select().from(moneyIntents).where(and(eq(moneyIntents.payeeId, payeeId), eq(moneyIntents.status, 'waiting_account'))).all();
  },

  unfinishedTransfers(tx: Db, bookingId: string): number {
    return tx
      .select({ id: moneyIntents.id })
      .from(moneyIntents)
      .where(and(eq(moneyIntents.bookingId, bookingId), eq(moneyIntents.kind, 'transfer'), ne(moneyIntents.status, 'done')))
      .all().length;
  },

  payoutAccount(tx: Db, userId: string): PayoutAccountRow | undefined {
    return tx.select().from(payoutAccounts).where(eq(payoutAccounts.userId, userId)).get();
  },

  payoutAccountByStripeId(tx: Db, accountId: string): PayoutAccountRow | undefined {
    return tx.select().from(payoutAccounts).where(eq(payoutAccounts.stripeAccountId, accountId)).get();
  },

  autoAccept(tx: Db, bookingId: string): AutoAcceptRow | undefined {
    return tx.select().from(autoAccepts).where(eq(autoAccepts.bookingId, bookingId)).get();
  },

  wasProcessed(tx: Db, eventId: string): boolean {
    return !!tx.select().from(processedEvents).where(eq(processedEvents.eventId, eventId)).get();
  },

  markProcessed(tx: Db, eventId: string, type: string): void {
    tx.insert(processedEvents).values({ eventId, type, processedAt: new Date() }).onConflictDoNothing().run();
  },

  names(tx: Db, ids: string[]): Map<string, string> {
    const unique = [...new Set(ids)];
    if (unique.length === 0) return new Map();
    return new Map(tx.select({ id: users.id, name: users.displayName }).from(users).where(inArray(users.id, unique)).all().map((u) => [u.id, u.name]));
  },

  email(tx: Db, id: string): string | undefined {
    return tx.select({ email: users.email }).from(users).where(eq(users.id, id)).get()?.email;
  },
};
