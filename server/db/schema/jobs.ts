import { sqliteTable, text, integer, index } from 'drizzle-orm/sqlite-core';

// The job runner's table: work that must survive a restart (mail outbox, checks, auto-accept).
export const jobs = sqliteTable(
  'jobs',
  {
    id: integer().primaryKey({ autoIncrement: true }),
    kind: text().notNull(),
    payload: text({ mode: 'json' }).$type<unknown>().notNull(),
    // A unique key makes enqueueing idempotent (e.g. one digest per user and window).
    dedupeKey: text().unique(),
    status: text({ enum: ['queued', 'running', 'done', 'failed'] }).notNull().default('queued'),
    runAt: integer().notNull(),
    attempts: integer().notNull().default(0),
    maxAttempts: integer().notNull().default(8),
    lockedBy: text(),
    lockedUntil: integer(),
    lastError: text(),
    createdAt: integer().notNull(),
    finishedAt: integer(),
  },
  (t) => [index('jobs_due_idx').on(t.status, t.runAt)],
);
