import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { Db } from './client';
import { users } from './schema';
import { hashPassword } from '../auth/password';
import { DEMO_PEOPLE } from './demo-world';
import { seedSteps, type SeedState } from './seed-steps';
import type { AppContext } from '../app';

export type SeedResult = { seeded: boolean; userIds: Record<string, string> };

export function isEmpty(db: Db): boolean {
  const row = db.select({ n: sql<number>`count(*)` }).from(users).get();
  return (row?.n ?? 0) === 0;
}

/**
 * Seeds the demo world once, on an empty database. Later features add their part through their
 * own services (seed steps registered in server/db/seed-steps.ts) so demo data obeys the same rules.
 */
export async function seedDemo(ctx: AppContext, demoPassword: string): Promise<SeedResult> {
  const db: Db = ctx.db;
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
  const state: SeedState = { userIds };
  for (const step of seedSteps) await step.run(ctx, state);
  return { seeded: true, userIds };
}
