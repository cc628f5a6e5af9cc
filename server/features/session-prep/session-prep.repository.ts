import { asc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { bookings, micPackages, quotes, rooms, sessionPrepEvents, users } from '../../db/schema';

export type PrepEventRow = { itemId: string; done: boolean; userId: string; displayName: string; at: Date };

export function createSessionPrepRepository(db: Db) {
  return {
    booking(id: string, tx: Db = db) {
      return tx.select().from(bookings).where(eq(bookings.id, id)).get();
    },
    /** The room behind a booking: through the package its quote named (the input list copy carries the id too). */
    roomOfQuote(quoteId: string) {
      return db
        .select({ id: rooms.id, name: rooms.name, town: rooms.town, engineerId: rooms.engineerId, packageName: micPackages.name })
        .from(quotes)
        .innerJoin(micPackages, eq(micPackages.id, quotes.packageId))
        .innerJoin(rooms, eq(rooms.id, micPackages.roomId))
        .where(eq(quotes.id, quoteId))
        .get();
    },
    events(bookingId: string, tx: Db = db): PrepEventRow[] {
      return tx
        .select({ itemId: sessionPrepEvents.itemId, done: sessionPrepEvents.done, userId: sessionPrepEvents.userId, displayName: users.displayName, at: sessionPrepEvents.at })
        .from(sessionPrepEvents)
        .innerJoin(users, eq(users.id, sessionPrepEvents.userId))
        .where(eq(sessionPrepEvents.bookingId, bookingId))
        .orderBy(asc(sessionPrepEvents.at), asc(sessionPrepEvents.id))
        .all();
    },
    insertEvent(row: typeof sessionPrepEvents.$inferInsert, tx: Db = db): void {
      tx.insert(sessionPrepEvents).values(row).run();
    },
  };
}
export type SessionPrepRepository = ReturnType<typeof createSessionPrepRepository>;
