import { and, asc, desc, eq, inArray } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { Db } from '../../db/client';
import { briefs, drummerProfiles, quotes, reelTracks, users } from '../../db/schema';

export type QuoteRow = typeof quotes.$inferSelect;
export type QuoteInsert = typeof quotes.$inferInsert;
export type QuoteWithNames = QuoteRow & { briefTitle: string; briefStatus: string; songwriterId: string; drummerName: string; engineerName: string | null };

const engineers = alias(users, 'engineers');

export function createQuotesRepository(db: Db) {
  function selectWithNames(tx: Db = db) {
    return tx
      .select({ quote: quotes, briefTitle: briefs.songTitle, briefStatus: briefs.status, songwriterId: briefs.songwriterId, drummerName: users.displayName, engineerName: engineers.displayName })
      .from(quotes)
      .innerJoin(briefs, eq(briefs.id, quotes.briefId))
      .innerJoin(users, eq(users.id, quotes.drummerId))
      .leftJoin(engineers, eq(engineers.id, quotes.engineerId));
  }
  type Joined = { quote: QuoteRow; briefTitle: string; briefStatus: string; songwriterId: string; drummerName: string; engineerName: string | null };
  const flatten = (r: Joined): QuoteWithNames => ({ ...r.quote, briefTitle: r.briefTitle, briefStatus: r.briefStatus, songwriterId: r.songwriterId, drummerName: r.drummerName, engineerName: r.engineerName });

  return {
    insert(row: QuoteInsert, tx: Db = db): void {
      tx.insert(quotes).values(row).run();
    },
    findById(id: string, tx: Db = db): QuoteWithNames | undefined {
      const r = selectWithNames(tx).where(eq(quotes.id, id)).get();
      return r ? flatten(r) : undefined;
    },
    listForBrief(briefId: string): QuoteWithNames[] {
      return selectWithNames().where(eq(quotes.briefId, briefId)).orderBy(asc(quotes.createdAt)).all().map(flatten);
    },
    listByDrummer(drummerId: string): QuoteWithNames[] {
      return selectWithNames().where(eq(quotes.drummerId, drummerId)).orderBy(desc(quotes.createdAt)).all().map(flatten);
    },
    listByEngineer(engineerId: string): QuoteWithNames[] {
      return selectWithNames().where(eq(quotes.engineerId, engineerId)).orderBy(desc(quotes.createdAt)).all().map(flatten);
    },
    /** Moves a quote on only while it is in one of `from`, so two clicks never both win. */
    transition(id: string, from: QuoteRow['status'][], patch: Partial<QuoteInsert>, tx: Db = db): QuoteRow | undefined {
      return tx
        .update(quotes)
        .set({ ...patch, updatedAt: new Date() })
        .where(and(eq(quotes.id, id), inArray(quotes.status, from)))
        .returning()
        .get();
    },
    user(id: string) {
      return db.select({ id: users.id, displayName: users.displayName, roles: users.roles, disabledAt: users.disabledAt }).from(users).where(eq(users.id, id)).get();
    },
    /** Rating and the first reel track of each drummer, for the comparison. */
    drummerCards(drummerIds: string[]) {
      if (drummerIds.length === 0) return new Map<string, { ratingAvg: number | null; ratingCount: number; reelTrackId: string | null; reelTrackTitle: string | null }>();
      const profiles = db.select({ id: drummerProfiles.userId, ratingAvg: drummerProfiles.ratingAvg, ratingCount: drummerProfiles.ratingCount }).from(drummerProfiles).where(inArray(drummerProfiles.userId, drummerIds)).all();
      const tracks = db.select({ id: reelTracks.id, drummerId: reelTracks.drummerId, title: reelTracks.title }).from(reelTracks).where(inArray(reelTracks.drummerId, drummerIds)).orderBy(asc(reelTracks.position), asc(reelTracks.createdAt)).all();
      const cards = new Map<string, { ratingAvg: number | null; ratingCount: number; reelTrackId: string | null; reelTrackTitle: string | null }>();
      for (const id of drummerIds) {
        const p = profiles.find((x) => x.id === id);
        const t = tracks.find((x) => x.drummerId === id);
        cards.set(id, { ratingAvg: p?.ratingAvg ?? null, ratingCount: p?.ratingCount ?? 0, reelTrackId: t?.id ?? null, reelTrackTitle: t?.title ?? null });
      }
      return cards;
    },
  };
}
export type QuotesRepository = ReturnType<typeof createQuotesRepository>;
