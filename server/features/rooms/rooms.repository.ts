import { and, asc, desc, eq, gte, inArray, isNull, lte, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { micPackages, roomBlockedDates, roomPhotos, rooms, users } from '../../db/schema';

export type RoomRow = typeof rooms.$inferSelect;
export type RoomInsert = typeof rooms.$inferInsert;
export type RoomPhotoRow = typeof roomPhotos.$inferSelect;
export type RoomWithCard = RoomRow & { engineerName: string; engineerDisabled: boolean; thumbPhotoId: string | null; packageCount: number };

/** Search filters in stored units: minor units, standard-time offset minutes, m³ and seconds. */
export type RoomSearchFilters = {
  words: string[];
  town?: string;
  offsetRange?: { min: number; max: number };
  minVolumeM3?: number;
  maxVolumeM3?: number;
  rtMinSec?: number;
  rtMaxSec?: number;
  currency?: string;
  maxDayRateMinor?: number;
  minInputs?: number;
  limit: number;
  offset: number;
};

/** LIKE treats % and _ as wildcards; a person typing them means the characters themselves. */
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

function searchConditions(f: RoomSearchFilters): SQL[] {
  const where: SQL[] = [isNull(rooms.archivedAt), isNull(users.disabledAt)];
  for (const word of f.words) {
    const p = likePattern(word);
    where.push(sql`(${rooms.name} LIKE ${p} ESCAPE '\\' OR ${rooms.town} LIKE ${p} ESCAPE '\\' OR ${rooms.description} LIKE ${p} ESCAPE '\\')`);
  }
  if (f.town) where.push(sql`${rooms.town} LIKE ${likePattern(f.town)} ESCAPE '\\'`);
  if (f.offsetRange) where.push(gte(rooms.utcOffsetMinutes, f.offsetRange.min), lte(rooms.utcOffsetMinutes, f.offsetRange.max));
  if (f.minVolumeM3 !== undefined) where.push(gte(rooms.volumeM3, f.minVolumeM3));
  if (f.maxVolumeM3 !== undefined) where.push(lte(rooms.volumeM3, f.maxVolumeM3));
  if (f.rtMinSec !== undefined) where.push(gte(rooms.midRt60Sec, f.rtMinSec));
  if (f.rtMaxSec !== undefined) where.push(lte(rooms.midRt60Sec, f.rtMaxSec));
  if (f.currency !== undefined) where.push(eq(rooms.currency, f.currency));
  if (f.maxDayRateMinor !== undefined) where.push(lte(rooms.dayRateMinor, f.maxDayRateMinor));
  if (f.minInputs !== undefined) where.push(gte(rooms.inputs, f.minInputs));
  return where;
}

export function createRoomsRepository(db: Db) {
  function selectCards(tx: Db = db) {
    return tx
      .select({
        room: rooms,
        engineerName: users.displayName,
        engineerDisabledAt: users.disabledAt,
        thumbPhotoId: sql<string | null>`(SELECT p.id FROM room_photos p WHERE p.room_id = ${rooms.id} ORDER BY p.position, p.created_at LIMIT 1)`,
        packageCount: sql<number>`(SELECT count(*) FROM mic_packages m WHERE m.room_id = ${rooms.id} AND m.archived_at IS NULL)`,
      })
      .from(rooms)
      .innerJoin(users, eq(users.id, rooms.engineerId));
  }
  type Joined = { room: RoomRow; engineerName: string; engineerDisabledAt: Date | null; thumbPhotoId: string | null; packageCount: number };
  const flatten = (r: Joined): RoomWithCard => ({
    ...r.room,
    engineerName: r.engineerName,
    engineerDisabled: r.engineerDisabledAt != null,
    thumbPhotoId: r.thumbPhotoId,
    packageCount: Number(r.packageCount),
  });

  return {
    insert(row: RoomInsert, tx: Db = db): void {
      tx.insert(rooms).values(row).run();
    },

    update(id: string, patch: Partial<RoomInsert>, tx: Db = db): void {
      tx.update(rooms).set(patch).where(eq(rooms.id, id)).run();
    },

    findById(id: string, tx: Db = db): RoomWithCard | undefined {
      const r = selectCards(tx).where(eq(rooms.id, id)).get();
      return r ? flatten(r) : undefined;
    },

    listByEngineer(engineerId: string): RoomWithCard[] {
      return selectCards()
        .where(and(eq(rooms.engineerId, engineerId), isNull(rooms.archivedAt)))
        .orderBy(desc(rooms.updatedAt))
        .all()
        .map(flatten);
    },

    search(f: RoomSearchFilters): { items: RoomWithCard[]; total: number } {
      const where = and(...searchConditions(f));
      const items = selectCards().where(where).orderBy(desc(rooms.createdAt), asc(rooms.id)).limit(f.limit).offset(f.offset).all().map(flatten);
      const total = db.select({ n: sql<number>`count(*)` }).from(rooms).innerJoin(users, eq(users.id, rooms.engineerId)).where(where).get()?.n ?? 0;
      return { items, total: Number(total) };
    },

    // ---- photos ----
    photos(roomId: string, tx: Db = db): RoomPhotoRow[] {
      return tx.select().from(roomPhotos).where(eq(roomPhotos.roomId, roomId)).orderBy(asc(roomPhotos.position), asc(roomPhotos.createdAt)).all();
    },
    photo(roomId: string, photoId: string): RoomPhotoRow | undefined {
      return db.select().from(roomPhotos).where(and(eq(roomPhotos.roomId, roomId), eq(roomPhotos.id, photoId))).get();
    },
    countPhotos(roomId: string, tx: Db = db): number {
      return tx.select({ n: sql<number>`count(*)` }).from(roomPhotos).where(eq(roomPhotos.roomId, roomId)).get()?.n ?? 0;
    },
    nextPhotoPosition(roomId: string, tx: Db = db): number {
      const max = tx.select({ m: sql<number | null>`max(${roomPhotos.position})` }).from(roomPhotos).where(eq(roomPhotos.roomId, roomId)).get()?.m;
      return max == null ? 0 : max + 1;
    },
    insertPhoto(row: typeof roomPhotos.$inferInsert, tx: Db = db): void {
      tx.insert(roomPhotos).values(row).run();
    },
    deletePhoto(roomId: string, photoId: string): void {
      db.delete(roomPhotos).where(and(eq(roomPhotos.roomId, roomId), eq(roomPhotos.id, photoId))).run();
    },

    // ---- calendar ----
    blockedDates(roomId: string): string[] {
      return db.select({ d: roomBlockedDates.date }).from(roomBlockedDates).where(eq(roomBlockedDates.roomId, roomId)).orderBy(asc(roomBlockedDates.date)).all().map((r) => r.d);
    },
    /** Replaces the whole set; dates before `keepFrom` are left alone (the past is not the engineer's to rewrite). */
    replaceBlockedDates(roomId: string, dates: string[], keepFrom: string, tx: Db = db): void {
      tx.delete(roomBlockedDates).where(and(eq(roomBlockedDates.roomId, roomId), gte(roomBlockedDates.date, keepFrom))).run();
      const future = dates.filter((d) => d >= keepFrom);
      if (future.length > 0) tx.insert(roomBlockedDates).values(future.map((date) => ({ roomId, date }))).onConflictDoNothing().run();
    },

    // ---- packages of a room (the rule "no more channels than inputs" looks at them) ----
    activePackages(roomId: string, tx: Db = db) {
      return tx
        .select({ id: micPackages.id, name: micPackages.name, channels: micPackages.channels })
        .from(micPackages)
        .where(and(eq(micPackages.roomId, roomId), isNull(micPackages.archivedAt)))
        .all();
    },
    archivePackagesOf(roomId: string, at: Date, tx: Db = db): void {
      tx.update(micPackages).set({ archivedAt: at, updatedAt: at }).where(and(eq(micPackages.roomId, roomId), isNull(micPackages.archivedAt))).run();
    },
    roomsByIds(ids: string[]): RoomWithCard[] {
      if (ids.length === 0) return [];
      return selectCards().where(inArray(rooms.id, ids)).all().map(flatten);
    },
  };
}
export type RoomsRepository = ReturnType<typeof createRoomsRepository>;
