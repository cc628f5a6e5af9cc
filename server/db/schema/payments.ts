import { sqliteTable, text, integer, index } from 'drizzle-orm/sqlite-core';
import { users } from './users';
import { bookings } from './briefs';

// Escrow around the processor (issue 4). The ledger (ledger.ts) holds the money; these tables hold what the
// app asked the processor to do and what it answered, so a half-finished step can be repaired.

/** A payee's connected account at the processor (drummers and engineers are paid by transfer to it). */
export const payoutAccounts = sqliteTable('payout_accounts', {
  userId: text()
    .primaryKey()
    .references(() => users.id, { onDelete: 'cascade' }),
  stripeAccountId: text().notNull().unique(),
  chargesEnabled: integer({ mode: 'boolean' }).notNull().default(false),
  payoutsEnabled: integer({ mode: 'boolean' }).notNull().default(false),
  transfersActive: integer({ mode: 'boolean' }).notNull().default(false),
  detailsSubmitted: integer({ mode: 'boolean' }).notNull().default(false),
  createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  updatedAt: integer({ mode: 'timestamp_ms' }).notNull(),
});

export const BOOKING_PAYMENT_KINDS = ['booking', 'add_on'] as const;
export const BOOKING_PAYMENT_STATUSES = ['creating', 'open', 'paid', 'expired', 'failed'] as const;

/** One checkout of a booking: the agreed total, or an add-on for changes beyond the included revisions. */
export const bookingPayments = sqliteTable(
  'booking_payments',
  {
    id: text().primaryKey(),
    bookingId: text()
      .notNull()
      .references(() => bookings.id),
    kind: text({ enum: BOOKING_PAYMENT_KINDS }).notNull(),
    idempotencyKey: text().notNull().unique(),
    sessionId: text().unique(),
    url: text(),
    /** The part that pays for the work (held in escrow); the service fee is on top. */
    workMinor: integer().notNull(),
    /** Extra revisions an add-on pays for (1 for the booking itself). */
    units: integer().notNull().default(1),
    feeMinor: integer().notNull(),
    amountMinor: integer().notNull(),
    currency: text().notNull(),
    status: text({ enum: BOOKING_PAYMENT_STATUSES }).notNull(),
    paymentIntentId: text(),
    chargeId: text().unique(),
    /** Committed against this charge by refund and transfer intents (the processor refuses more). */
    refundedMinor: integer().notNull().default(0),
    transferredMinor: integer().notNull().default(0),
    lastError: text(),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
    paidAt: integer({ mode: 'timestamp_ms' }),
  },
  (t) => [index('booking_payments_booking_idx').on(t.bookingId)],
);

export const MONEY_INTENT_KINDS = ['transfer', 'refund'] as const;
export const MONEY_INTENT_STATUSES = ['pending', 'waiting_account', 'done', 'failed'] as const;

/**
 * An outgoing call the app decided to make (transfer to a payee, refund to the songwriter). Written with
 * the decision; done when the processor's answer is in the ledger. Pending rows are retried by a job
 * with the same idempotency key, so a crash between the call and the ledger write never pays twice.
 */
export const moneyIntents = sqliteTable(
  'money_intents',
  {
    id: text().primaryKey(),
    bookingId: text()
      .notNull()
      .references(() => bookings.id),
    kind: text({ enum: MONEY_INTENT_KINDS }).notNull(),
    /** Derived from booking, action and version (plus payee and charge): the processor's idempotency key. */
    idempotencyKey: text().notNull().unique(),
    payeeId: text().references(() => users.id),
    chargeId: text().notNull(),
    amountMinor: integer().notNull(),
    currency: text().notNull(),
    /** The ledger account the money waits in until the processor has it: payable:<user> or refunds. */
    fromAccount: text().notNull(),
    status: text({ enum: MONEY_INTENT_STATUSES }).notNull(),
    processorId: text(),
    reason: text().notNull(),
    attempts: integer().notNull().default(0),
    lastError: text(),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
    doneAt: integer({ mode: 'timestamp_ms' }),
  },
  (t) => [index('money_intents_booking_idx').on(t.bookingId), index('money_intents_status_idx').on(t.status)],
);

/** Money-side facts about a booking that its own row does not carry. */
export const bookingMoney = sqliteTable('booking_money', {
  bookingId: text()
    .primaryKey()
    .references(() => bookings.id),
  changeRequests: integer().notNull().default(0),
  addOnsPaid: integer().notNull().default(0),
  /** Parties who asked to cancel a funded booking; all of them agreeing refunds it. */
  cancelRequestedBy: text({ mode: 'json' }).$type<string[]>().notNull(),
  /** How the escrow ended: release, refund or split (null while money is held). */
  outcome: text({ enum: ['release', 'refund', 'split'] }),
  updatedAt: integer({ mode: 'timestamp_ms' }).notNull(),
});

/** The review-window clock of a delivered booking; a dispute cancels it. */
export const autoAccepts = sqliteTable('auto_accepts', {
  bookingId: text()
    .primaryKey()
    .references(() => bookings.id),
  deliveredAt: integer({ mode: 'timestamp_ms' }).notNull(),
  dueAt: integer({ mode: 'timestamp_ms' }).notNull(),
  status: text({ enum: ['scheduled', 'cancelled', 'done'] }).notNull(),
  updatedAt: integer({ mode: 'timestamp_ms' }).notNull(),
});

/** Webhook events already handled (events repeat; the id is the dedupe key). */
export const processedEvents = sqliteTable('processed_events', {
  eventId: text().primaryKey(),
  type: text().notNull(),
  processedAt: integer({ mode: 'timestamp_ms' }).notNull(),
});
