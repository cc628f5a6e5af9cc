import { desc, eq, or } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { displayNamesById } from '../../db/lookups';
import { bookings } from '../../db/schema';

export type BookingRow = typeof bookings.$inferSelect;
export type BookingInsert = typeof bookings.$inferInsert;

export function createBookingsRepository(db: Db) {
  return {
    findById(id: string, tx: Db = db): BookingRow | undefined {
      return tx.select().from(bookings).where(eq(bookings.id, id)).get();
    },
    listForParty(userId: string): BookingRow[] {
      return db
        .select()
        .from(bookings)
        .where(or(eq(bookings.songwriterId, userId), eq(bookings.drummerId, userId), eq(bookings.engineerId, userId)))
        .orderBy(desc(bookings.createdAt))
        .all();
    },
    listAll(): BookingRow[] {
      return db.select().from(bookings).orderBy(desc(bookings.createdAt)).all();
    },
    names(ids: string[]): Map<string, string> {
      return displayNamesById(db, ids);
    },
  };
}
export type BookingsRepository = ReturnType<typeof createBookingsRepository>;
