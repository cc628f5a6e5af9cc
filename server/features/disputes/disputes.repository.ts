import { and, asc, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { displayNamesById, songTitlesByBookingId } from '../../db/lookups';
import { bookings, disputes, users } from '../../db/schema';
import type { DisputeStatus } from '@shared/schemas/disputes';

export type DisputeRow = typeof disputes.$inferSelect;
type Tx = Pick<Db, 'select' | 'insert' | 'update'>;

export function createDisputesRepository(db: Db) {
  return {
    findById(id: string, tx: Pick<Db, 'select'> = db): DisputeRow | undefined {
      return tx.select().from(disputes).where(eq(disputes.id, id)).get();
    },
    forBooking(bookingId: string): DisputeRow[] {
      return db.select().from(disputes).where(eq(disputes.bookingId, bookingId)).orderBy(desc(disputes.createdAt)).all();
    },
    /** Open ones oldest first (the desk works the queue from its head); settled ones newest first. */
    byStatus(status: DisputeStatus | undefined): DisputeRow[] {
      const where = status ? eq(disputes.status, status) : undefined;
      const order = status === 'open' ? [asc(disputes.createdAt), asc(disputes.id)] : [desc(disputes.createdAt), desc(disputes.id)];
      return db
        .select()
        .from(disputes)
        .where(where)
        .orderBy(...order)
        .all();
    },
    openIdsByBooking(bookingIds: string[]): Map<string, string> {
      if (bookingIds.length === 0) return new Map();
      const rows = db
        .select({ id: disputes.id, bookingId: disputes.bookingId })
        .from(disputes)
        .where(and(inArray(disputes.bookingId, bookingIds), eq(disputes.status, 'open')))
        .all();
      return new Map(rows.map((r) => [r.bookingId, r.id]));
    },
    insert(row: typeof disputes.$inferInsert, tx: Tx): void {
      tx.insert(disputes).values(row).run();
    },
    /** Takes the decision only if nobody took one first: two admins clicking at once get one settlement. */
    claimDecision(id: string, decision: Pick<DisputeRow, 'outcome' | 'heldMinor' | 'songwriterMinor' | 'feeRefundMinor' | 'payeesMinor' | 'decidedBy' | 'decisionNote' | 'decidedAt'>, tx: Tx): boolean {
      const result = tx
        .update(disputes)
        .set({ ...decision, lastError: null })
        .where(and(eq(disputes.id, id), eq(disputes.status, 'open'), isNull(disputes.decidedAt)))
        .run();
      return result.changes === 1;
    },
    /** A decision the processor refused before any money moved is withdrawn, so the admin can decide again. */
    dropDecision(id: string, error: string): void {
      db.update(disputes)
        .set({ outcome: null, heldMinor: null, songwriterMinor: null, feeRefundMinor: null, payeesMinor: null, decidedBy: null, decisionNote: null, decidedAt: null, lastError: error })
        .where(and(eq(disputes.id, id), eq(disputes.status, 'open')))
        .run();
    },
    noteError(id: string, error: string): void {
      db.update(disputes).set({ lastError: error }).where(eq(disputes.id, id)).run();
    },
    markSettled(id: string, at: Date, tx: Tx): boolean {
      const result = tx.update(disputes).set({ status: 'settled', settledAt: at, lastError: null }).where(and(eq(disputes.id, id), eq(disputes.status, 'open'))).run();
      return result.changes === 1;
    },
    decidedButUnsettled(): DisputeRow[] {
      return db
        .select()
        .from(disputes)
        .where(and(eq(disputes.status, 'open'), sql`${disputes.decidedAt} is not null`))
        .all();
    },
    /** Admins to tell about a new dispute; roles are a JSON array, so the quoted id matches exactly. */
    adminIds(): string[] {
      return db
        .select({ id: users.id })
        .from(users)
        .where(and(sql`${users.roles} like '%"admin"%'`, isNull(users.disabledAt)))
        .all()
        .map((u) => u.id);
    },
    findBooking(id: string, tx: Pick<Db, 'select'> = db) {
      return tx.select().from(bookings).where(eq(bookings.id, id)).get();
    },
    names(ids: string[]): Map<string, string> {
      return displayNamesById(db, ids);
    },
    songTitles(bookingIds: string[]): Map<string, string> {
      return songTitlesByBookingId(db, bookingIds);
    },
  };
}
export type DisputesRepository = ReturnType<typeof createDisputesRepository>;
