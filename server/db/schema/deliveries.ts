import { sqliteTable, text, integer, real, index, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { users } from './users';
import { bookings } from './briefs';
import type { DeliveryCheckReport } from '../../../shared/schemas/delivery-check';

// Stem deliveries (issue 5). A delivery is `uploading → checking → ready`; submitting it (booking →
// delivered) and the songwriter's answer are timestamps and a decision beside that state. The dispute
// desk reads `deliveries` and `delivery_checks` by column name (server/features/disputes/case-deliveries.ts).

export const deliveries = sqliteTable(
  'deliveries',
  {
    id: text().primaryKey(),
    bookingId: text()
      .notNull()
      .references(() => bookings.id),
    number: integer().notNull(),
    status: text({ enum: ['uploading', 'checking', 'ready'] }).notNull().default('uploading'),
    note: text().notNull().default(''),
    createdById: text()
      .notNull()
      .references(() => users.id),
    // Bumped whenever the set of files or their parts changes: a check job for an older run is void.
    checkRun: integer().notNull().default(0),
    checkStatus: text({ enum: ['waiting', 'running', 'done', 'failed'] }).notNull().default('waiting'),
    checkProgress: real().notNull().default(0),
    checkLabel: text().notNull().default(''),
    checkError: text(),
    submittedAt: integer({ mode: 'timestamp_ms' }),
    decision: text({ enum: ['changes_requested', 'accepted'] }),
    decidedAt: integer({ mode: 'timestamp_ms' }),
    decidedById: text().references(() => users.id),
    changeMessage: text(),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
    updatedAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [uniqueIndex('deliveries_booking_number_uq').on(t.bookingId, t.number)],
);

export const deliveryFiles = sqliteTable(
  'delivery_files',
  {
    // Also the tus upload id, so an upload is tied to exactly one file row of one delivery.
    id: text().primaryKey(),
    deliveryId: text()
      .notNull()
      .references(() => deliveries.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    part: text(),
    sizeBytes: integer().notNull(),
    status: text({ enum: ['uploading', 'uploaded'] }).notNull().default('uploading'),
    sha256: text(),
    storageKey: text(),
    previewKey: text(),
    previewStatus: text({ enum: ['pending', 'ready', 'failed'] }).notNull().default('pending'),
    peaksKey: text(),
    position: integer().notNull(),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
    uploadedAt: integer({ mode: 'timestamp_ms' }),
  },
  (t) => [uniqueIndex('delivery_files_name_uq').on(t.deliveryId, t.name), index('delivery_files_delivery_idx').on(t.deliveryId)],
);

/** One check report per run; the newest run is the delivery's report. */
export const deliveryChecks = sqliteTable(
  'delivery_checks',
  {
    id: text().primaryKey(),
    deliveryId: text()
      .notNull()
      .references(() => deliveries.id, { onDelete: 'cascade' }),
    run: integer().notNull(),
    report: text({ mode: 'json' }).$type<DeliveryCheckReport>().notNull(),
    level: text({ enum: ['pass', 'warn', 'fail'] }).notNull(),
    summary: text().notNull(),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [uniqueIndex('delivery_checks_run_uq').on(t.deliveryId, t.run)],
);

/** A songwriter's note at a point of the timeline (optionally on one stem); sent with a request for changes. */
export const deliveryNotes = sqliteTable(
  'delivery_notes',
  {
    id: text().primaryKey(),
    deliveryId: text()
      .notNull()
      .references(() => deliveries.id, { onDelete: 'cascade' }),
    authorId: text()
      .notNull()
      .references(() => users.id),
    atSec: real().notNull(),
    fileId: text().references(() => deliveryFiles.id, { onDelete: 'set null' }),
    body: text().notNull(),
    requestedAt: integer({ mode: 'timestamp_ms' }),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('delivery_notes_delivery_idx').on(t.deliveryId, t.atSec)],
);
