import { sqliteTable, text, integer, real, index, primaryKey, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { BOOKING_STATUSES } from '../../../shared/schemas/bookings';
import { users } from './users';

export const briefs = sqliteTable(
  'briefs',
  {
    id: text().primaryKey(),
    songwriterId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    status: text({ enum: ['draft', 'open', 'hired', 'closed', 'withdrawn'] }).notNull().default('draft'),
    songTitle: text().notNull(),
    description: text().notNull().default(''),
    drumNotes: text().notNull().default(''),
    style: text().notNull().default(''),
    tempoBpm: real().notNull(),
    timeSignature: text().notNull().default('4/4'),
    musicalKey: text().notNull().default(''),
    lengthBars: integer(),
    lengthSeconds: integer(),
    songCount: integer().notNull().default(1),
    guideAudioKey: text(),
    guidePeaksKey: text(),
    guideMime: text(),
    guideName: text(),
    guideDurationSec: real(),
    referenceNotes: text().notNull().default(''),
    sampleRate: integer().notNull().default(48000),
    bitDepth: text({ enum: ['24', '32f'] }).notNull().default('24'),
    stemMode: text({ enum: ['every_mic', 'named'] }).notNull().default('every_mic'),
    stemList: text({ mode: 'json' }).$type<string[]>().notNull().default([]),
    roughMix: integer({ mode: 'boolean' }).notNull().default(false),
    budgetMinMinor: integer().notNull(),
    budgetMaxMinor: integer().notNull(),
    currency: text().notNull(),
    // A calendar date (YYYY-MM-DD) in the songwriter's time zone, kept with that zone.
    deadline: text().notNull(),
    timeZone: text().notNull().default('UTC'),
    needsRoom: integer({ mode: 'boolean' }).notNull().default(false),
    publishedAt: integer({ mode: 'timestamp_ms' }),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
    updatedAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('briefs_status_idx').on(t.status, t.publishedAt), index('briefs_owner_idx').on(t.songwriterId)],
);

export const briefInvites = sqliteTable(
  'brief_invites',
  {
    briefId: text()
      .notNull()
      .references(() => briefs.id, { onDelete: 'cascade' }),
    drummerId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.briefId, t.drummerId] })],
);

export type QuoteLineItem = { kind: 'per_song' | 'package' | 'rush' | 'extra_revision' | 'other'; label: string; unitAmount: number; quantity: number };

export const quotes = sqliteTable(
  'quotes',
  {
    id: text().primaryKey(),
    briefId: text()
      .notNull()
      .references(() => briefs.id, { onDelete: 'cascade' }),
    drummerId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    status: text({ enum: ['sent', 'accepted', 'declined', 'withdrawn', 'expired'] }).notNull().default('sent'),
    lineItems: text({ mode: 'json' }).$type<QuoteLineItem[]>().notNull(),
    // Computed on the server from the line items; the price of an extra revision is quoted but not in the total.
    totalMinor: integer().notNull(),
    currency: text().notNull(),
    revisionsIncluded: integer().notNull(),
    extraRevisionMinor: integer().notNull().default(0),
    turnaroundDays: integer().notNull(),
    recordingDate: text(),
    rightsTerms: text({ enum: ['buyout', 'credit', 'points'] }).notNull(),
    royaltyPoints: real(),
    message: text().notNull().default(''),
    validUntil: integer({ mode: 'timestamp_ms' }).notNull(),
    packageId: text(),
    engineerId: text().references(() => users.id),
    engineerShareMinor: integer().notNull().default(0),
    engineerStatus: text({ enum: ['none', 'pending', 'confirmed', 'declined'] }).notNull().default('none'),
    declineReason: text(),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
    updatedAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [uniqueIndex('quotes_brief_drummer_uq').on(t.briefId, t.drummerId), index('quotes_drummer_idx').on(t.drummerId)],
);

export type BookingTerms = {
  songTitle: string;
  lineItems: QuoteLineItem[];
  totalMinor: number;
  currency: string;
  revisionsIncluded: number;
  extraRevisionMinor: number;
  turnaroundDays: number;
  recordingDate: string | null;
  rightsTerms: 'buyout' | 'credit' | 'points';
  royaltyPoints: number | null;
  deliverables: { sampleRate: number; bitDepth: '24' | '32f'; stemMode: 'every_mic' | 'named'; stemList: string[]; roughMix: boolean };
  tempoBpm: number;
  timeSignature: string;
  lengthBars: number | null;
  lengthSeconds: number | null;
  packageName: string | null;
};

// The lifecycle words live with the API's booking shape; the column accepts exactly those.
export { BOOKING_STATUSES };

export const bookings = sqliteTable(
  'bookings',
  {
    id: text().primaryKey(),
    briefId: text()
      .notNull()
      .references(() => briefs.id),
    quoteId: text()
      .notNull()
      .unique()
      .references(() => quotes.id),
    songwriterId: text()
      .notNull()
      .references(() => users.id),
    drummerId: text()
      .notNull()
      .references(() => users.id),
    engineerId: text().references(() => users.id),
    status: text({ enum: BOOKING_STATUSES }).notNull().default('awaiting_payment'),
    // A frozen copy of what was agreed: later edits to the quote or profiles never change it.
    terms: text({ mode: 'json' }).$type<BookingTerms>().notNull(),
    totalMinor: integer().notNull(),
    currency: text().notNull(),
    drummerShareMinor: integer().notNull(),
    engineerShareMinor: integer().notNull().default(0),
    // Copy of the mic package's input list, when the quote named one (rooms issue).
    inputList: text({ mode: 'json' }).$type<unknown>(),
    // Bumped on every state change; money actions derive their idempotency keys from it.
    version: integer().notNull().default(1),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
    updatedAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [
    index('bookings_songwriter_idx').on(t.songwriterId),
    index('bookings_drummer_idx').on(t.drummerId),
    index('bookings_engineer_idx').on(t.engineerId),
  ],
);
