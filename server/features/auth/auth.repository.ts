import { and, eq, gt, isNull } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { emailTokens, users } from '../../db/schema';

export type UserRow = typeof users.$inferSelect;

export function createAuthRepository(db: Db) {
  return {
    findByEmail(email: string): UserRow | undefined {
      return db.select().from(users).where(eq(users.email, email)).get();
    },
    findById(id: string): UserRow | undefined {
      return db.select().from(users).where(eq(users.id, id)).get();
    },
    insertUser(row: typeof users.$inferInsert): void {
      db.insert(users).values(row).run();
    },
    updateUser(id: string, patch: Partial<typeof users.$inferInsert>): void {
      db.update(users).set(patch).where(eq(users.id, id)).run();
    },
    insertToken(row: typeof emailTokens.$inferInsert): void {
      db.insert(emailTokens).values(row).run();
    },
    /** Marks a live token used and returns it, or nothing when it is unknown, used or expired. */
    consumeToken(tokenHash: string, purpose: 'verify_email' | 'reset_password', now: Date) {
      return db
        .update(emailTokens)
        .set({ usedAt: now })
        .where(
          and(
            eq(emailTokens.tokenHash, tokenHash),
            eq(emailTokens.purpose, purpose),
            isNull(emailTokens.usedAt),
            gt(emailTokens.expiresAt, now),
          ),
        )
        .returning()
        .get();
    },
  };
}
export type AuthRepository = ReturnType<typeof createAuthRepository>;
