// The audit log (issue 4): every admin action is recorded in the same transaction as the action, so the
// log can never miss an action that happened nor show one that was rolled back.
import { randomUUID } from 'node:crypto';
import type { Db } from '../../db/client';
import type { CurrentUser } from '../../auth/middleware';
import { assertCan } from '../../auth/middleware';
import type { AuditAction, AuditAmounts, AuditEntryView, AuditList, AuditQuery } from '@shared/schemas/admin';
import { createAuditRepository, insertAuditRow, type AuditRow } from './audit.repository';

export type AuditRecord = {
  /** Null only for the command line, which acts without a signed-in person. */
  actorId: string | null;
  action: AuditAction;
  targetType: AuditRow['targetType'];
  targetId: string;
  amounts?: AuditAmounts | null;
  note?: string;
  at?: Date;
};

/** Writes one audit row inside the caller's transaction (pass the `tx` of the action it records). */
export function recordAudit(tx: Pick<Db, 'insert'>, record: AuditRecord): void {
  insertAuditRow(tx, {
    id: randomUUID(),
    actorId: record.actorId,
    action: record.action,
    targetType: record.targetType,
    targetId: record.targetId,
    amounts: record.amounts ?? null,
    note: record.note ?? '',
    createdAt: record.at ?? new Date(),
  });
}

export function createAuditService(deps: { db: Db }) {
  const repo = createAuditRepository(deps.db);

  function toViews(rows: AuditRow[]): AuditEntryView[] {
    const people = repo.userLabels(rows.flatMap((r) => [...(r.actorId ? [r.actorId] : []), ...(r.targetType === 'user' ? [r.targetId] : [])]));
    const bookingTitles = repo.bookingTitles(rows.filter((r) => r.targetType === 'booking').map((r) => r.targetId));
    const disputeTitles = repo.disputeTitles(rows.filter((r) => r.targetType === 'dispute').map((r) => r.targetId));
    const labelOf = (r: AuditRow) => {
      if (r.targetType === 'user') return people.get(r.targetId) ?? 'Deleted account';
      const titles = r.targetType === 'booking' ? bookingTitles : disputeTitles;
      return `${r.targetType === 'booking' ? 'Booking' : 'Dispute'} on “${titles.get(r.targetId) ?? 'unknown'}”`;
    };
    return rows.map((r) => ({
      id: r.id,
      actor: { id: r.actorId, displayName: r.actorId ? (people.get(r.actorId) ?? 'Deleted account') : 'Command line' },
      action: r.action,
      targetType: r.targetType,
      targetId: r.targetId,
      targetLabel: labelOf(r),
      amounts: r.amounts,
      note: r.note,
      createdAt: r.createdAt.toISOString(),
    }));
  }

  return {
    /** Newest first; admins only (the log names accounts and amounts). */
    list(user: CurrentUser, query: AuditQuery): AuditList {
      assertCan(user, 'read:audit:any');
      return { items: toViews(repo.page(query.limit, query.offset)), total: repo.count() };
    },

    forTarget(user: CurrentUser, targetType: AuditRow['targetType'], targetId: string): AuditEntryView[] {
      assertCan(user, 'read:audit:any');
      return toViews(repo.forTarget(targetType, targetId));
    },
  };
}
export type AuditService = ReturnType<typeof createAuditService>;
