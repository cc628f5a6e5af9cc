import { and, eq, gt, ne } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { quotes } from '../../db/schema';
import type { Notifications } from '../notifications/notifications.service';

/**
 * Declines every quote on a brief that is still waiting (sent and not expired), except `except`, and tells
 * each drummer. Runs inside the caller's transaction: withdrawing a brief and accepting a quote use it.
 */
export function declineWaitingQuotes(
  tx: Db,
  notifications: Notifications,
  brief: { id: string; songTitle: string },
  opts: { reason: string; except: string | null; now?: Date },
): number {
  const now = opts.now ?? new Date();
  const waiting = and(eq(quotes.briefId, brief.id), eq(quotes.status, 'sent'), gt(quotes.validUntil, now), opts.except ? ne(quotes.id, opts.except) : undefined);
  const declined = tx.update(quotes).set({ status: 'declined', declineReason: opts.reason, updatedAt: now }).where(waiting).returning({ id: quotes.id, drummerId: quotes.drummerId }).all();
  for (const q of declined) {
    notifications.notify(
      q.drummerId,
      {
        kind: 'quote_declined',
        title: `Your quote for “${brief.songTitle}” was declined`,
        body: opts.reason,
        link: `/quotes/${q.id}`,
      },
      tx,
    );
  }
  return declined.length;
}
