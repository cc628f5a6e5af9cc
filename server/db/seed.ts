import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { Db } from './client';
import { users } from './schema';
import { hashPassword } from '../auth/password';
import { DEMO_PEOPLE } from './demo-world';

export type SeedResult = { seeded: boolean; userIds: Record<string, string> };

export function isEmpty(db: Db): boolean {
  const row = db.select({ n: sql<number>`count(*)` }).from(users).get();
  return (row?.n ?? 0) === 0;
}

/**
 * Seeds the demo world once, on an empty database. Later features add their part through their
 * own services (seed steps registered in server/db/seed-steps.ts) so demo data obeys the same rules.
 */
export async function seedDemo(db: Db, demoPassword: string): Promise<SeedResult> {
  if (!isEmpty(db)) return { seeded: false, userIds: {} };
  // One hash for all demo accounts: they share DEMO_PASSWORD, and argon2 is deliberately slow.
  const passwordHash = await hashPassword(demoPassword);
  const userIds: Record<string, string> = {};
  const now = new Date();
  db.transaction((tx) => {
    for (const person of DEMO_PEOPLE) {
      const id = randomUUID();
      userIds[person.key] = id;
      tx.insert(users)
        .values({
          id,
          email: person.email,
          displayName: person.displayName,
          passwordHash,
          roles: person.roles,
          emailVerifiedAt: now,
          timeZone: person.timeZone,
          createdAt: now,
        })
        .run();
    }
  });
  return { seeded: true, userIds };
}
