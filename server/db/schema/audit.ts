import { sqliteTable, text, integer, index } from 'drizzle-orm/sqlite-core';
import { users } from './users';
import { AUDIT_ACTIONS, type AuditAmounts } from '../../../shared/schemas/admin';

/**
 * Every admin action (issue 4): who, what, on which target, the amounts, when. Rows are only ever
 * inserted, in the same transaction as the action they record.
 */
export const auditLog = sqliteTable(
  'audit_log',
  {
    id: text().primaryKey(),
    // Null for the command line (npm run admin:grant), which has no signed-in person.
    actorId: text().references(() => users.id),
    action: text({ enum: AUDIT_ACTIONS }).notNull(),
    targetType: text({ enum: ['booking', 'dispute', 'user'] }).notNull(),
    targetId: text().notNull(),
    amounts: text({ mode: 'json' }).$type<AuditAmounts>(),
    note: text().notNull().default(''),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('audit_log_created_idx').on(t.createdAt), index('audit_log_target_idx').on(t.targetType, t.targetId)],
);
