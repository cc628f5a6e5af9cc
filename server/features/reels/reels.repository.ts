import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import type { Queryable } from '../profiles/profiles.repository';
import { reelTracks } from '../../db/schema';
import type { ReelTrackSummary } from '@shared/schemas/profiles';

export type ReelTrackRow = typeof reelTracks.$inferSelect;
export type NewReelTrackRow = typeof reelTracks.$inferInsert;

export function toReelTrackSummary(row: ReelTrackRow): ReelTrackSummary {
  return {
    id: row.id,
    title: row.title,
    style: row.style,
    tempoBpm: row.tempoBpm,
    mime: row.mime,
    sizeBytes: row.sizeBytes,
    durationSec: row.durationSec,
    hasPeaks: row.peaksKey != null,
    position: row.position,
  };
}

export function createReelsRepository(db: Db) {
  return {
    findById(id: string, tx: Queryable = db): ReelTrackRow | undefined {
      return tx.select().from(reelTracks).where(eq(reelTracks.id, id)).get();
    },

    listByDrummer(drummerId: string, tx: Queryable = db): ReelTrackRow[] {
      return tx.select().from(reelTracks).where(eq(reelTracks.drummerId, drummerId)).orderBy(asc(reelTracks.position), asc(reelTracks.createdAt)).all();
    },

    countByDrummer(drummerId: string, tx: Queryable = db): number {
      return tx.select({ n: sql<number>`count(*)` }).from(reelTracks).where(eq(reelTracks.drummerId, drummerId)).get()?.n ?? 0;
    },

    nextPosition(drummerId: string, tx: Queryable = db): number {
      const row = tx.select({ p: sql<number | null>`max(${reelTracks.position})` }).from(reelTracks).where(eq(reelTracks.drummerId, drummerId)).get();
      return (row?.p ?? -1) + 1;
    },

    insert(row: NewReelTrackRow, tx: Queryable = db): void {
      tx.insert(reelTracks).values(row).run();
    },

    delete(id: string, drummerId: string, tx: Queryable = db): boolean {
      return tx.delete(reelTracks).where(and(eq(reelTracks.id, id), eq(reelTracks.drummerId, drummerId))).run().changes > 0;
    },

    setPositions(drummerId: string, ids: string[], tx: Queryable = db): void {
      ids.forEach((id, position) => {
        tx.update(reelTracks).set({ position }).where(and(eq(reelTracks.id, id), eq(reelTracks.drummerId, drummerId))).run();
      });
    },

    idsOf(drummerId: string, ids: string[], tx: Queryable = db): string[] {
      if (ids.length === 0) return [];
      return tx
        .select({ id: reelTracks.id })
        .from(reelTracks)
        .where(and(eq(reelTracks.drummerId, drummerId), inArray(reelTracks.id, ids)))
        .all()
        .map((r) => r.id);
    },
  };
}
export type ReelsRepository = ReturnType<typeof createReelsRepository>;
