import { sqliteTable, text, integer, index, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { users } from './users';
import { bookings } from './briefs';
import { REVIEW_SUBJECT_ROLES } from '../../../shared/schemas/reviews';

// One review per booking and person reviewed: the unique index turns a second one into a 409.
export const reviews = sqliteTable(
  'reviews',
  {
    id: text().primaryKey(),
    bookingId: text()
      .notNull()
      .references(() => bookings.id),
    reviewerId: text()
      .notNull()
      .references(() => users.id),
    subjectId: text()
      .notNull()
      .references(() => users.id),
    subjectRole: text({ enum: REVIEW_SUBJECT_ROLES }).notNull(),
    rating: integer().notNull(),
    text: text().notNull(),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [uniqueIndex('reviews_booking_subject_uq').on(t.bookingId, t.subjectId), index('reviews_subject_idx').on(t.subjectId, t.createdAt)],
);
