import { sqliteTable, text, integer, real, index } from 'drizzle-orm/sqlite-core';
import { users } from './users';

export const drummerProfiles = sqliteTable(
  'drummer_profiles',
  {
    userId: text()
      .primaryKey()
      .references(() => users.id, { onDelete: 'cascade' }),
    headline: text().notNull().default(''),
    bio: text().notNull().default(''),
    styles: text({ mode: 'json' }).$type<string[]>().notNull().default([]),
    tags: text({ mode: 'json' }).$type<string[]>().notNull().default([]),
    kit: text().notNull().default(''),
    baseRateMinor: integer().notNull().default(0),
    currency: text().notNull().default('USD'),
    turnaroundDays: integer().notNull().default(7),
    revisionsIncluded: integer().notNull().default(2),
    takingWork: integer({ mode: 'boolean' }).notNull().default(true),
    town: text().notNull().default(''),
    country: text().notNull().default(''),
    timeZone: text().notNull().default('UTC'),
    // Standard-time offset of the zone in minutes, kept for the "time zone band" filter.
    utcOffsetMinutes: integer().notNull().default(0),
    ratingAvg: real(),
    ratingCount: integer().notNull().default(0),
    published: integer({ mode: 'boolean' }).notNull().default(false),
    updatedAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('drummer_profiles_rate_idx').on(t.baseRateMinor), index('drummer_profiles_offset_idx').on(t.utcOffsetMinutes)],
);

export const engineerProfiles = sqliteTable('engineer_profiles', {
  userId: text()
    .primaryKey()
    .references(() => users.id, { onDelete: 'cascade' }),
  headline: text().notNull().default(''),
  bio: text().notNull().default(''),
  services: text({ mode: 'json' }).$type<string[]>().notNull().default([]),
  town: text().notNull().default(''),
  country: text().notNull().default(''),
  timeZone: text().notNull().default('UTC'),
  updatedAt: integer({ mode: 'timestamp_ms' }).notNull(),
});

export const reelTracks = sqliteTable(
  'reel_tracks',
  {
    id: text().primaryKey(),
    drummerId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    title: text().notNull(),
    style: text().notNull().default(''),
    tempoBpm: integer(),
    // Storage keys (app-generated, never user input).
    audioKey: text().notNull(),
    peaksKey: text(),
    mime: text().notNull(),
    sizeBytes: integer().notNull(),
    durationSec: real(),
    position: integer().notNull().default(0),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('reel_tracks_drummer_idx').on(t.drummerId, t.position)],
);
