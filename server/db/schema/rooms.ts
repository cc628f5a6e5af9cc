import { sqliteTable, text, integer, real, index, primaryKey } from 'drizzle-orm/sqlite-core';
import { users } from './users';
import { bookings } from './briefs';
import type { RoomInput } from '@shared/schemas/rooms';
import type { MicChannelInput } from '@shared/schemas/mic-packages';

// Rooms and mic packages are never hard-deleted while something may point at them: a quote or a booking
// names a package, a package names its room. "Removing" one sets archivedAt; it leaves search and lists.
export const rooms = sqliteTable(
  'rooms',
  {
    id: text().primaryKey(),
    engineerId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    town: text().notNull(),
    timeZone: text().notNull(),
    // Standard-time offset of the zone in minutes, for the search's time zone band (as drummer profiles do).
    utcOffsetMinutes: integer().notNull(),
    description: text().notNull().default(''),
    dayRateMinor: integer().notNull(),
    halfDayRateMinor: integer().notNull(),
    currency: text().notNull(),
    inputs: integer().notNull(),
    // The geometry as the engineer typed it (feet stay feet), so the form shows it back unchanged.
    dimensions: text({ mode: 'json' }).$type<RoomInput['dimensions']>().notNull(),
    surfaces: text({ mode: 'json' }).$type<RoomInput['surfaces']>().notNull(),
    panels: text({ mode: 'json' }).$type<RoomInput['panels']>().notNull(),
    openings: text({ mode: 'json' }).$type<RoomInput['openings']>().notNull(),
    // Computed from the geometry on every write (computeAcoustics) so search can filter on them.
    volumeM3: real().notNull(),
    floorAreaM2: real().notNull(),
    midRt60Sec: real().notNull(),
    reading: text({ enum: ['tight', 'controlled', 'lively', 'very_live'] }).notNull(),
    archivedAt: integer({ mode: 'timestamp_ms' }),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
    updatedAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [
    index('rooms_engineer_idx').on(t.engineerId),
    index('rooms_rate_idx').on(t.currency, t.dayRateMinor),
    index('rooms_rt_idx').on(t.midRt60Sec),
    index('rooms_offset_idx').on(t.utcOffsetMinutes),
  ],
);

export const roomPhotos = sqliteTable(
  'room_photos',
  {
    id: text().primaryKey(),
    roomId: text()
      .notNull()
      .references(() => rooms.id, { onDelete: 'cascade' }),
    // Storage keys (app-generated). Both are re-encoded by the server; the uploaded original is not kept.
    largeKey: text().notNull(),
    thumbKey: text().notNull(),
    width: integer().notNull(),
    height: integer().notNull(),
    caption: text().notNull().default(''),
    position: integer().notNull().default(0),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('room_photos_room_idx').on(t.roomId, t.position)],
);

export const roomBlockedDates = sqliteTable(
  'room_blocked_dates',
  {
    roomId: text()
      .notNull()
      .references(() => rooms.id, { onDelete: 'cascade' }),
    // A calendar date (YYYY-MM-DD) in the room's time zone.
    date: text().notNull(),
  },
  (t) => [primaryKey({ columns: [t.roomId, t.date] })],
);

export const micPackages = sqliteTable(
  'mic_packages',
  {
    id: text().primaryKey(),
    roomId: text()
      .notNull()
      .references(() => rooms.id, { onDelete: 'cascade' }),
    engineerId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text().notNull(),
    priceMinor: integer().notNull(),
    currency: text().notNull(),
    // The input list in its order (the order is the engineer's; channel numbers are the inputs they use).
    channels: text({ mode: 'json' }).$type<MicChannelInput[]>().notNull(),
    archivedAt: integer({ mode: 'timestamp_ms' }),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
    updatedAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('mic_packages_room_idx').on(t.roomId), index('mic_packages_engineer_idx').on(t.engineerId)],
);

/** Append-only: every tick and untick of a booking's prep checklist, with who and when. */
export const sessionPrepEvents = sqliteTable(
  'session_prep_events',
  {
    id: text().primaryKey(),
    bookingId: text()
      .notNull()
      .references(() => bookings.id, { onDelete: 'cascade' }),
    itemId: text().notNull(),
    done: integer({ mode: 'boolean' }).notNull(),
    userId: text()
      .notNull()
      .references(() => users.id),
    at: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('session_prep_events_booking_idx').on(t.bookingId, t.at)],
);
