import { and, asc, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { deliveries, deliveryChecks, deliveryFiles, deliveryNotes, users } from '../../db/schema';

export type DeliveryRow = typeof deliveries.$inferSelect;
export type DeliveryFileRow = typeof deliveryFiles.$inferSelect;
export type DeliveryNoteRow = typeof deliveryNotes.$inferSelect;
export type DeliveryCheckRow = typeof deliveryChecks.$inferSelect;

// Plain rows; every function takes the db or a transaction handle (same query API).
export const deliveriesRepo = {
  delivery(tx: Db, id: string): DeliveryRow | undefined {
    return tx.select().from(deliveries).where(eq(deliveries.id, id)).get();
  },
  forBooking(tx: Db, bookingId: string): DeliveryRow[] {
    return tx.select().from(deliveries).where(eq(deliveries.bookingId, bookingId)).orderBy(asc(deliveries.number)).all();
  },
  latestNumber(tx: Db, bookingId: string): number {
    const row = tx.select({ n: sql<number>`coalesce(max(${deliveries.number}), 0)` }).from(deliveries).where(eq(deliveries.bookingId, bookingId)).get();
    return Number(row?.n ?? 0);
  },
  openDelivery(tx: Db, bookingId: string): DeliveryRow | undefined {
    return tx.select().from(deliveries).where(and(eq(deliveries.bookingId, bookingId), isNull(deliveries.submittedAt))).get();
  },
  latestSubmitted(tx: Db, bookingId: string): DeliveryRow | undefined {
    return tx
      .select()
      .from(deliveries)
      .where(and(eq(deliveries.bookingId, bookingId), sql`${deliveries.submittedAt} is not null`))
      .orderBy(desc(deliveries.number))
      .limit(1)
      .get();
  },
  files(tx: Db, deliveryId: string): DeliveryFileRow[] {
    return tx.select().from(deliveryFiles).where(eq(deliveryFiles.deliveryId, deliveryId)).orderBy(asc(deliveryFiles.position)).all();
  },
  filesOf(tx: Db, deliveryIds: string[]): DeliveryFileRow[] {
    if (deliveryIds.length === 0) return [];
    return tx.select().from(deliveryFiles).where(inArray(deliveryFiles.deliveryId, deliveryIds)).orderBy(asc(deliveryFiles.position)).all();
  },
  file(tx: Db, id: string): DeliveryFileRow | undefined {
    return tx.select().from(deliveryFiles).where(eq(deliveryFiles.id, id)).get();
  },
  nextPosition(tx: Db, deliveryId: string): number {
    const row = tx.select({ n: sql<number>`coalesce(max(${deliveryFiles.position}), 0)` }).from(deliveryFiles).where(eq(deliveryFiles.deliveryId, deliveryId)).get();
    return Number(row?.n ?? 0) + 1;
  },
  notes(tx: Db, deliveryIds: string[]): DeliveryNoteRow[] {
    if (deliveryIds.length === 0) return [];
    return tx.select().from(deliveryNotes).where(inArray(deliveryNotes.deliveryId, deliveryIds)).orderBy(asc(deliveryNotes.atSec), asc(deliveryNotes.createdAt)).all();
  },
  note(tx: Db, id: string): DeliveryNoteRow | undefined {
    return tx.select().from(deliveryNotes).where(eq(deliveryNotes.id, id)).get();
  },
  latestCheck(tx: Db, deliveryId: string): DeliveryCheckRow | undefined {
    return tx.select().from(deliveryChecks).where(eq(deliveryChecks.deliveryId, deliveryId)).orderBy(desc(deliveryChecks.run)).limit(1).get();
  },
  checkOfRun(tx: Db, deliveryId: string, run: number): DeliveryCheckRow | undefined {
    return tx.select().from(deliveryChecks).where(and(eq(deliveryChecks.deliveryId, deliveryId), eq(deliveryChecks.run, run))).get();
  },
  updateDelivery(tx: Db, id: string, values: Partial<DeliveryRow>): void {
    tx.update(deliveries).set({ ...values, updatedAt: new Date() }).where(eq(deliveries.id, id)).run();
  },
  updateFile(tx: Db, id: string, values: Partial<DeliveryFileRow>): void {
    tx.update(deliveryFiles).set(values).where(eq(deliveryFiles.id, id)).run();
  },
  names(tx: Db, ids: string[]): Map<string, string> {
    const unique = [...new Set(ids)];
    if (unique.length === 0) return new Map();
    const rows = tx.select({ id: users.id, displayName: users.displayName }).from(users).where(inArray(users.id, unique)).all();
    return new Map(rows.map((r) => [r.id, r.displayName]));
  },
};
