import { and, desc, eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { displayNamesById, songTitlesByBookingId } from '../../db/lookups';
import { bookings, drummerProfiles, reviews, users } from '../../db/schema';
import { roundRating, type ReviewSubjectRole } from '@shared/schemas/reviews';

export type ReviewRow = typeof reviews.$inferSelect;
type Tx = Pick<Db, 'select' | 'insert' | 'update'>;

/** Count and sum straight from the reviews, so the profile figures can always be rebuilt from them. */
function statsIn(tx: Pick<Db, 'select'>, subjectId: string, role: ReviewSubjectRole): { count: number; sum: number } {
  const row = tx
    .select({ count: sql<number>`count(*)`, sum: sql<number>`coalesce(sum(${reviews.rating}), 0)` })
    .from(reviews)
    .where(and(eq(reviews.subjectId, subjectId), eq(reviews.subjectRole, role)))
    .get();
  return { count: Number(row?.count ?? 0), sum: Number(row?.sum ?? 0) };
}

export function createReviewsRepository(db: Db) {
  const stats = (subjectId: string, role: ReviewSubjectRole, tx: Pick<Db, 'select'> = db) => statsIn(tx, subjectId, role);
  return {
    findBooking(id: string) {
      return db.select().from(bookings).where(eq(bookings.id, id)).get();
    },
    findUser(id: string) {
      return db.select({ id: users.id, displayName: users.displayName, roles: users.roles, disabledAt: users.disabledAt }).from(users).where(eq(users.id, id)).get();
    },
    forBooking(bookingId: string): ReviewRow[] {
      return db.select().from(reviews).where(eq(reviews.bookingId, bookingId)).orderBy(desc(reviews.createdAt)).all();
    },
    forSubject(subjectId: string, role: ReviewSubjectRole, limit: number): ReviewRow[] {
      return db
        .select()
        .from(reviews)
        .where(and(eq(reviews.subjectId, subjectId), eq(reviews.subjectRole, role)))
        .orderBy(desc(reviews.createdAt), desc(reviews.id))
        .limit(limit)
        .all();
    },
    stats,
    insert(row: typeof reviews.$inferInsert, tx: Tx = db): void {
      tx.insert(reviews).values(row).run();
    },
    /** Writes the drummer's average and count (what search sorts on); a drummer without a profile row has none to update. */
    updateDrummerRating(drummerId: string, tx: Tx): void {
      const { count, sum } = statsIn(tx, drummerId, 'drummer');
      tx.update(drummerProfiles).set({ ratingAvg: roundRating(sum, count), ratingCount: count }).where(eq(drummerProfiles.userId, drummerId)).run();
    },
    names(ids: string[]): Map<string, string> {
      return displayNamesById(db, ids);
    },
    songTitles(bookingIds: string[]): Map<string, string> {
      return songTitlesByBookingId(db, bookingIds);
    },
  };
}
export type ReviewsRepository = ReturnType<typeof createReviewsRepository>;
