import { eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { drummerProfiles, engineerProfiles, users } from '../../db/schema';

/** The database or an open transaction: repositories run inside a service's transaction when given one. */
export type Queryable = Pick<Db, 'select' | 'insert' | 'update' | 'delete'>;

export type DrummerProfileRow = typeof drummerProfiles.$inferSelect;
export type EngineerProfileRow = typeof engineerProfiles.$inferSelect;
export type ProfileOwner = { id: string; displayName: string; roles: string[]; disabledAt: Date | null };

export function createProfilesRepository(db: Db) {
  return {
    findOwner(userId: string, tx: Queryable = db): ProfileOwner | undefined {
      return tx
        .select({ id: users.id, displayName: users.displayName, roles: users.roles, disabledAt: users.disabledAt })
        .from(users)
        .where(eq(users.id, userId))
        .get();
    },

    findDrummer(userId: string, tx: Queryable = db): DrummerProfileRow | undefined {
      return tx.select().from(drummerProfiles).where(eq(drummerProfiles.userId, userId)).get();
    },

    /** One row per drummer; the search triggers (drizzle/0003) follow every insert and update. */
    upsertDrummer(row: DrummerProfileRow, tx: Queryable = db): void {
      const { userId: _key, ratingAvg: _avg, ratingCount: _count, ...changes } = row;
      tx.insert(drummerProfiles).values(row).onConflictDoUpdate({ target: drummerProfiles.userId, set: changes }).run();
    },

    findEngineer(userId: string, tx: Queryable = db): EngineerProfileRow | undefined {
      return tx.select().from(engineerProfiles).where(eq(engineerProfiles.userId, userId)).get();
    },

    upsertEngineer(row: EngineerProfileRow, tx: Queryable = db): void {
      const { userId: _key, ...changes } = row;
      tx.insert(engineerProfiles).values(row).onConflictDoUpdate({ target: engineerProfiles.userId, set: changes }).run();
    },
  };
}
export type ProfilesRepository = ReturnType<typeof createProfilesRepository>;
