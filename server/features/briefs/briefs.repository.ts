import { and, desc, eq, gte, inArray, lte, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { briefInvites, briefs, quotes, users } from '../../db/schema';
import type { OpenBriefsQuery } from '@shared/schemas/briefs';

export type BriefRow = typeof briefs.$inferSelect;
export type BriefInsert = typeof briefs.$inferInsert;

export type OpenBriefRow = BriefRow & { songwriterName: string; invited: number; myQuoteId: string | null };

export function createBriefsRepository(db: Db) {
  return {
    insert(row: BriefInsert, tx: Db = db): void {
      tx.insert(briefs).values(row).run();
    },

    findById(id: string, tx: Db = db): BriefRow | undefined {
      return tx.select().from(briefs).where(eq(briefs.id, id)).get();
    },

    update(id: string, patch: Partial<BriefInsert>, tx: Db = db): BriefRow | undefined {
      return tx.update(briefs).set(patch).where(eq(briefs.id, id)).returning().get();
    },

    /** Moves a brief from one of `from` to `to`; undefined when it was not in one of them (lost a race). */
    transition(id: string, from: BriefRow['status'][], to: BriefRow['status'], patch: Partial<BriefInsert> = {}, tx: Db = db) {
      return tx
        .update(briefs)
        .set({ ...patch, status: to, updatedAt: new Date() })
        .where(and(eq(briefs.id, id), inArray(briefs.status, from)))
        .returning()
        .get();
    },

    listByOwner(songwriterId: string): BriefRow[] {
      return db.select().from(briefs).where(eq(briefs.songwriterId, songwriterId)).orderBy(desc(briefs.updatedAt)).all();
    },

    userName(id: string): string {
      return db.select({ n: users.displayName }).from(users).where(eq(users.id, id)).get()?.n ?? 'Unknown';
    },

    usersByIds(ids: string[]) {
      if (ids.length === 0) return [];
      return db.select({ id: users.id, displayName: users.displayName, roles: users.roles, disabledAt: users.disabledAt }).from(users).where(inArray(users.id, ids)).all();
    },

    isInvited(briefId: string, drummerId: string): boolean {
      return !!db
        .select({ b: briefInvites.briefId })
        .from(briefInvites)
        .where(and(eq(briefInvites.briefId, briefId), eq(briefInvites.drummerId, drummerId)))
        .get();
    },

    invitedDrummers(briefId: string) {
      return db
        .select({ id: users.id, displayName: users.displayName })
        .from(briefInvites)
        .innerJoin(users, eq(users.id, briefInvites.drummerId))
        .where(eq(briefInvites.briefId, briefId))
        .orderBy(briefInvites.createdAt)
        .all();
    },

    /** Inserts the invites that do not exist yet and returns the drummers newly invited. */
    addInvites(briefId: string, drummerIds: string[], now: Date, tx: Db = db): string[] {
      const added: string[] = [];
      for (const drummerId of drummerIds) {
        const res = tx.insert(briefInvites).values({ briefId, drummerId, createdAt: now }).onConflictDoNothing().run();
        if (res.changes > 0) added.push(drummerId);
      }
      return added;
    },

    quoteOf(briefId: string, drummerId: string) {
      return db
        .select({ id: quotes.id, status: quotes.status })
        .from(quotes)
        .where(and(eq(quotes.briefId, briefId), eq(quotes.drummerId, drummerId)))
        .get();
    },

    quoteCounts(briefIds: string[]): Map<string, number> {
      if (briefIds.length === 0) return new Map();
      const rows = db
        .select({ briefId: quotes.briefId, n: sql<number>`count(*)` })
        .from(quotes)
        .where(inArray(quotes.briefId, briefIds))
        .groupBy(quotes.briefId)
        .all();
      return new Map(rows.map((r) => [r.briefId, r.n]));
    },

    /**
     * Open briefs for one drummer: the ones they were invited to first, then the newest; never their own.
     * budgetMin keeps briefs whose top of the range reaches it (in `currency` when given); deadlineBefore is inclusive.
     */
    listOpen(drummerId: string, q: OpenBriefsQuery, limit: number, offset: number): { rows: OpenBriefRow[]; total: number } {
      const where: SQL[] = [eq(briefs.status, 'open'), sql`${briefs.songwriterId} <> ${drummerId}`];
      if (q.style) where.push(eq(briefs.style, q.style));
      if (q.budgetMin !== undefined) where.push(gte(briefs.budgetMaxMinor, q.budgetMin));
      if (q.currency) where.push(eq(briefs.currency, q.currency));
      if (q.deadlineBefore) where.push(lte(briefs.deadline, q.deadlineBefore));
      if (q.tempoMin !== undefined) where.push(gte(briefs.tempoBpm, q.tempoMin));
      if (q.tempoMax !== undefined) where.push(lte(briefs.tempoBpm, q.tempoMax));
      const condition = and(...where);
      const invited = sql<number>`exists (select 1 from ${briefInvites} where ${briefInvites.briefId} = ${briefs.id} and ${briefInvites.drummerId} = ${drummerId})`;
      const myQuoteId = sql<string | null>`(select ${quotes.id} from ${quotes} where ${quotes.briefId} = ${briefs.id} and ${quotes.drummerId} = ${drummerId})`;
      const rows = db
        .select({ brief: briefs, songwriterName: users.displayName, invited, myQuoteId })
        .from(briefs)
        .innerJoin(users, eq(users.id, briefs.songwriterId))
        .where(condition)
        .orderBy(desc(invited), desc(briefs.publishedAt), desc(briefs.id))
        .limit(limit)
        .offset(offset)
        .all();
      const total = db.select({ n: sql<number>`count(*)` }).from(briefs).where(condition).get()?.n ?? 0;
      return { rows: rows.map((r) => ({ ...r.brief, songwriterName: r.songwriterName, invited: r.invited, myQuoteId: r.myQuoteId })), total };
    },
  };
}
export type BriefsRepository = ReturnType<typeof createBriefsRepository>;
