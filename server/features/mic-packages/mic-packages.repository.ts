import { and, desc, eq, gt, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { micPackages, quotes, rooms, users } from '../../db/schema';

export type MicPackageRow = typeof micPackages.$inferSelect;
export type MicPackageInsert = typeof micPackages.$inferInsert;
export type MicPackageWithRoom = MicPackageRow & {
  roomName: string;
  roomTown: string;
  roomInputs: number;
  roomArchived: boolean;
  engineerName: string;
  engineerDisabled: boolean;
};

export function createMicPackagesRepository(db: Db) {
  function selectWithRoom(tx: Db = db) {
    return tx
      .select({
        pkg: micPackages,
        roomName: rooms.name,
        roomTown: rooms.town,
        roomInputs: rooms.inputs,
        roomArchivedAt: rooms.archivedAt,
        engineerName: users.displayName,
        engineerDisabledAt: users.disabledAt,
      })
      .from(micPackages)
      .innerJoin(rooms, eq(rooms.id, micPackages.roomId))
      .innerJoin(users, eq(users.id, micPackages.engineerId));
  }
  type Joined = { pkg: MicPackageRow; roomName: string; roomTown: string; roomInputs: number; roomArchivedAt: Date | null; engineerName: string; engineerDisabledAt: Date | null };
  const flatten = (r: Joined): MicPackageWithRoom => ({
    ...r.pkg,
    roomName: r.roomName,
    roomTown: r.roomTown,
    roomInputs: r.roomInputs,
    roomArchived: r.roomArchivedAt != null,
    engineerName: r.engineerName,
    engineerDisabled: r.engineerDisabledAt != null,
  });

  return {
    insert(row: MicPackageInsert, tx: Db = db): void {
      tx.insert(micPackages).values(row).run();
    },
    update(id: string, patch: Partial<MicPackageInsert>, tx: Db = db): void {
      tx.update(micPackages).set(patch).where(eq(micPackages.id, id)).run();
    },
    findById(id: string, tx: Db = db): MicPackageWithRoom | undefined {
      const r = selectWithRoom(tx).where(eq(micPackages.id, id)).get();
      return r ? flatten(r) : undefined;
    },
    listForRoom(roomId: string): MicPackageWithRoom[] {
      return selectWithRoom().where(and(eq(micPackages.roomId, roomId), isNull(micPackages.archivedAt))).orderBy(micPackages.createdAt).all().map(flatten);
    },
    listByEngineer(engineerId: string): MicPackageWithRoom[] {
      return selectWithRoom()
        .where(and(eq(micPackages.engineerId, engineerId), isNull(micPackages.archivedAt)))
        .orderBy(desc(micPackages.updatedAt))
        .all()
        .map(flatten);
    },
    /** Quotes still waiting for an answer that name one of these packages (expired ones no longer count). */
    waitingQuoteCount(packageIds: string[], now: Date, tx: Db = db): number {
      if (packageIds.length === 0) return 0;
      const row = tx
        .select({ n: sql<number>`count(*)` })
        .from(quotes)
        .where(and(inArray(quotes.packageId, packageIds), eq(quotes.status, 'sent'), gt(quotes.validUntil, now)))
        .get();
      return Number(row?.n ?? 0);
    },
  };
}
export type MicPackagesRepository = ReturnType<typeof createMicPackagesRepository>;
