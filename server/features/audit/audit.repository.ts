import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { songTitlesByBookingId } from '../../db/lookups';
import { auditLog, bookings, disputes, users } from '../../db/schema';

export type AuditRow = typeof auditLog.$inferSelect;
export type AuditInsert = typeof auditLog.$inferInsert;

// The db or a transaction handle: audit rows are written inside the action's own transaction.
type Writable = Pick<Db, 'insert'>;

export function insertAuditRow(tx: Writable, row: AuditInsert): void {
  tx.insert(auditLog).values(row).run();
}

export function createAuditRepository(db: Db) {
  return {
    page(limit: number, offset: number): AuditRow[] {
      return db.select().from(auditLog).orderBy(desc(auditLog.createdAt), desc(auditLog.id)).limit(limit).offset(offset).all();
    },
    count(): number {
      return db.select({ n: sql<number>`count(*)` }).from(auditLog).get()?.n ?? 0;
    },
    forTarget(targetType: AuditRow['targetType'], targetId: string): AuditRow[] {
      return db
        .select()
        .from(auditLog)
        .where(and(eq(auditLog.targetType, targetType), eq(auditLog.targetId, targetId)))
        .orderBy(desc(auditLog.createdAt), desc(auditLog.id))
        .all();
    },
    /** "Name (email)" per user id: the log must say unambiguously who did what to whom. */
    userLabels(ids: string[]): Map<string, string> {
      const unique = [...new Set(ids)];
      if (unique.length === 0) return new Map();
      const rows = db.select({ id: users.id, displayName: users.displayName, email: users.email }).from(users).where(inArray(users.id, unique)).all();
      return new Map(rows.map((r) => [r.id, `${r.displayName} (${r.email})`]));
    },
    bookingTitles(ids: string[]): Map<string, string> {
      return songTitlesByBookingId(db, ids);
    },
    disputeTitles(ids: string[]): Map<string, string> {
      const unique = [...new Set(ids)];
      if (unique.length === 0) return new Map();
      const rows = db
        .select({ id: disputes.id, terms: bookings.terms })
        .from(disputes)
        .innerJoin(bookings, eq(bookings.id, disputes.bookingId))
        .where(inArray(disputes.id, unique))
        .all();
      return new Map(rows.map((r) => [r.id, r.terms.songTitle]));
    },
  };
}
export type AuditRepository = ReturnType<typeof createAuditRepository>;
