import { sqliteTable, text, integer, index, primaryKey, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { users } from './users';
import { briefs, bookings } from './briefs';
import { NOTIFICATION_KINDS, type NotificationKind } from '../../../shared/schemas/notifications';

// One thread per (brief, drummer) before hiring and one per booking after.
export const threads = sqliteTable(
  'threads',
  {
    id: text().primaryKey(),
    kind: text({ enum: ['brief', 'booking'] }).notNull(),
    briefId: text().references(() => briefs.id, { onDelete: 'cascade' }),
    drummerId: text().references(() => users.id),
    bookingId: text().references(() => bookings.id, { onDelete: 'cascade' }),
    subject: text().notNull(),
    lastMessageAt: integer({ mode: 'timestamp_ms' }),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [uniqueIndex('threads_brief_drummer_uq').on(t.briefId, t.drummerId), uniqueIndex('threads_booking_uq').on(t.bookingId)],
);

export const threadParticipants = sqliteTable(
  'thread_participants',
  {
    threadId: text()
      .notNull()
      .references(() => threads.id, { onDelete: 'cascade' }),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    lastReadAt: integer({ mode: 'timestamp_ms' }),
    // Messages up to this time were already in a digest mail to this participant (never mailed twice).
    digestedUntil: integer({ mode: 'timestamp_ms' }),
  },
  (t) => [primaryKey({ columns: [t.threadId, t.userId] }), index('thread_participants_user_idx').on(t.userId)],
);

export const messages = sqliteTable(
  'messages',
  {
    id: text().primaryKey(),
    threadId: text()
      .notNull()
      .references(() => threads.id, { onDelete: 'cascade' }),
    senderId: text()
      .notNull()
      .references(() => users.id),
    body: text().notNull(),
    attachmentKey: text(),
    attachmentName: text(),
    attachmentMime: text(),
    attachmentSize: integer(),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('messages_thread_idx').on(t.threadId, t.createdAt)],
);

// The list lives in shared/ so the client's settings page uses the same kinds (relative import: drizzle-kit
// reads this file without the @shared alias).
export { NOTIFICATION_KINDS, type NotificationKind };

export const notifications = sqliteTable(
  'notifications',
  {
    id: text().primaryKey(),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    kind: text({ enum: NOTIFICATION_KINDS }).notNull(),
    title: text().notNull(),
    body: text().notNull().default(''),
    link: text().notNull(),
    readAt: integer({ mode: 'timestamp_ms' }),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('notifications_user_idx').on(t.userId, t.createdAt)],
);

// A row means "do not mail me this kind"; the in-app list always shows everything.
export const notificationMutes = sqliteTable(
  'notification_mutes',
  {
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    kind: text({ enum: NOTIFICATION_KINDS }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.kind] })],
);
