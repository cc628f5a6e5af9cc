import { and, desc, eq, or, sql, type AnyColumn, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { Db } from '../../db/client';
import { bookings, users } from '../../db/schema';
import type { BookingStatus } from '@shared/schemas/bookings';

export type UserRow = typeof users.$inferSelect;
type Tx = Pick<Db, 'update' | 'select'>;

/** `%q%` for LIKE with the wildcards in the search text itself escaped. */
function containing(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

function matches(column: AnyColumn | SQL, q: string): SQL {
  return sql`${column} like ${containing(q)} escape '\\'`;
}

const songwriter = alias(users, 'songwriter');
const drummer = alias(users, 'drummer');
const engineer = alias(users, 'engineer');

export function createAdminRepository(db: Db) {
  return {
    findUser(id: string, tx: Pick<Db, 'select'> = db): UserRow | undefined {
      return tx.select().from(users).where(eq(users.id, id)).get();
    },

    accounts(q: string | undefined, limit: number, offset: number) {
      const where = q ? or(matches(users.email, q), matches(users.displayName, q), eq(users.id, q)) : undefined;
      // Bookings as any party, for a sense of how much an account is involved before disabling it.
      // Written out in full: inside a subquery Drizzle would leave the outer column unqualified ("id" = the booking's).
      const bookingCount = sql<number>`(select count(*) from bookings b where b.songwriter_id = "users"."id" or b.drummer_id = "users"."id" or b.engineer_id = "users"."id")`;
      const rows = db
        .select({ user: users, bookings: bookingCount })
        .from(users)
        .where(where)
        .orderBy(desc(users.createdAt), desc(users.id))
        .limit(limit)
        .offset(offset)
        .all();
      const total = db.select({ n: sql<number>`count(*)` }).from(users).where(where).get()?.n ?? 0;
      return { rows, total };
    },

    setDisabled(id: string, at: Date | null, tx: Tx): void {
      tx.update(users).set({ disabledAt: at }).where(eq(users.id, id)).run();
    },

    setRoles(id: string, roles: string[], tx: Tx): void {
      tx.update(users).set({ roles }).where(eq(users.id, id)).run();
    },

    bookings(q: string | undefined, status: BookingStatus | undefined, limit: number, offset: number) {
      const where: SQL[] = [];
      if (status) where.push(eq(bookings.status, status));
      if (q) {
        const any = [
          eq(bookings.id, q),
          matches(sql`json_extract(${bookings.terms}, '$.songTitle')`, q),
          ...[songwriter, drummer, engineer].flatMap((person) => [matches(person.displayName, q), matches(person.email, q)]),
        ];
        where.push(or(...any)!);
      }
      const base = () =>
        db
          .select({
            booking: bookings,
            songwriter: songwriter.displayName,
            drummer: drummer.displayName,
            engineer: engineer.displayName,
          })
          .from(bookings)
          .innerJoin(songwriter, eq(songwriter.id, bookings.songwriterId))
          .innerJoin(drummer, eq(drummer.id, bookings.drummerId))
          .leftJoin(engineer, eq(engineer.id, bookings.engineerId))
          .where(where.length ? and(...where) : undefined);
      const rows = base().orderBy(desc(bookings.updatedAt), desc(bookings.id)).limit(limit).offset(offset).all();
      const total = db
        .select({ n: sql<number>`count(*)` })
        .from(bookings)
        .innerJoin(songwriter, eq(songwriter.id, bookings.songwriterId))
        .innerJoin(drummer, eq(drummer.id, bookings.drummerId))
        .leftJoin(engineer, eq(engineer.id, bookings.engineerId))
        .where(where.length ? and(...where) : undefined)
        .get()?.n ?? 0;
      return { rows, total };
    },
  };
}
export type AdminRepository = ReturnType<typeof createAdminRepository>;
