import { sqliteTable, text, integer, index } from 'drizzle-orm/sqlite-core';

export const users = sqliteTable('users', {
  id: text().primaryKey(),
  email: text().notNull().unique(),
  displayName: text().notNull(),
  passwordHash: text().notNull(),
  // JSON array of role ids from shared/permissions.ts; 'admin' only ever set by the seed or admin:grant.
  roles: text({ mode: 'json' }).$type<string[]>().notNull(),
  emailVerifiedAt: integer({ mode: 'timestamp_ms' }),
  disabledAt: integer({ mode: 'timestamp_ms' }),
  timeZone: text().notNull().default('UTC'),
  createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
});

// Column names as lucia's Drizzle adapter expects them (id, user_id, expires_at in seconds).
export const sessions = sqliteTable(
  'sessions',
  {
    id: text().primaryKey(),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    expiresAt: integer().notNull(),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);

// One-time tokens for mail verification and password reset; only the SHA-256 of the token is stored.
export const emailTokens = sqliteTable(
  'email_tokens',
  {
    tokenHash: text().primaryKey(),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    purpose: text({ enum: ['verify_email', 'reset_password'] }).notNull(),
    expiresAt: integer({ mode: 'timestamp_ms' }).notNull(),
    usedAt: integer({ mode: 'timestamp_ms' }),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('email_tokens_user_idx').on(t.userId)],
);
