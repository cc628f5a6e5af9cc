import { sqliteTable, text, integer, index } from 'drizzle-orm/sqlite-core';
import { users } from './users';
import { bookings, BOOKING_STATUSES } from './briefs';
// Relative imports: drizzle-kit reads this file without the @shared alias.
import { DISPUTE_OUTCOMES, DISPUTE_REASONS, DISPUTE_STATUSES } from '../../../shared/schemas/disputes';

/**
 * A dispute on a booking (DESIGN.md: `open → settled` with outcome release | refund | split). The decision
 * columns are written before the processor is called and `settledAt` after the money moved, so a settlement
 * left half-way is visible and finished by a job.
 */
export const disputes = sqliteTable(
  'disputes',
  {
    id: text().primaryKey(),
    bookingId: text()
      .notNull()
      .references(() => bookings.id),
    openedBy: text()
      .notNull()
      .references(() => users.id),
    reason: text({ enum: DISPUTE_REASONS }).notNull(),
    text: text().notNull(),
    status: text({ enum: DISPUTE_STATUSES }).notNull().default('open'),
    bookingStatusBefore: text({ enum: BOOKING_STATUSES }).notNull(),
    outcome: text({ enum: DISPUTE_OUTCOMES }),
    currency: text().notNull(),
    heldMinor: integer(),
    songwriterMinor: integer(),
    payeesMinor: integer(),
    // A full refund also returns the songwriter's service fee (escrow.service refundBooking).
    feeRefundMinor: integer(),
    decidedBy: text().references(() => users.id),
    decisionNote: text(),
    decidedAt: integer({ mode: 'timestamp_ms' }),
    settledAt: integer({ mode: 'timestamp_ms' }),
    lastError: text(),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('disputes_status_idx').on(t.status, t.createdAt), index('disputes_booking_idx').on(t.bookingId)],
);
