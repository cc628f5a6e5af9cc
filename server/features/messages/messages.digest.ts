import type { Db } from '../../db/client';
import type { JobRunner } from '../../jobs/runner';
import type { Mailer } from '../../mail/outbox';
import { composeMail } from '../../mail/templates';
import type { Notifications } from '../notifications/notifications.service';
import { unsubscribeFooter } from '../notifications/notifications.service';
import type { MessagesRepository } from './messages.repository';
import { previewOf } from '@shared/schemas/messages';

export const DIGEST_JOB = 'messages.digest';
/** Previews per conversation in one mail; the rest is counted, the link shows all. */
const PREVIEWS_PER_THREAD = 3;

export type DigestScheduler = {
  /** Called in the sending transaction, once per recipient of a new message. */
  schedule(recipientId: string, sentAt: Date, tx: Pick<Db, 'insert'>): void;
};

type DigestPayload = { userId: string };
type PendingMessage = ReturnType<MessagesRepository['undigestedUnread']>[number];

/**
 * "A new message not read within the delay → one digest mail": the first message of a window schedules one
 * job per recipient (the dedupe key is the recipient and the window), later messages of the same window
 * ride along. When the job runs it mails whatever is still unread and not mailed before — possibly nothing,
 * when the recipient has read it meanwhile.
 */
export function createDigests(deps: { db: Db; repo: MessagesRepository; jobs: JobRunner; mailer: Mailer; notifications: Notifications; appUrl: string; delayMs: number }) {
  const { db, repo, jobs, mailer, notifications, appUrl, delayMs } = deps;

  const scheduler: DigestScheduler = {
    schedule(recipientId, sentAt, tx) {
      const window = Math.floor(sentAt.getTime() / delayMs);
      jobs.enqueue(DIGEST_JOB, { userId: recipientId } satisfies DigestPayload, { runAt: sentAt.getTime() + delayMs, dedupeKey: `${DIGEST_JOB}:${recipientId}:${window}` }, tx);
    },
  };

  function groupByThread(pending: PendingMessage[]): Map<string, PendingMessage[]> {
    const groups = new Map<string, PendingMessage[]>();
    for (const p of pending) groups.set(p.message.threadId, [...(groups.get(p.message.threadId) ?? []), p]);
    return groups;
  }

  function paragraphsFor(groups: Map<string, PendingMessage[]>): string[] {
    const paragraphs: string[] = [];
    for (const [threadId, items] of groups) {
      const lines = items.slice(-PREVIEWS_PER_THREAD).map((i) => `${i.senderName}: “${previewOf(i.message.body || `sent ${i.message.attachmentName ?? 'a file'}`, 200)}”`);
      const more = items.length > PREVIEWS_PER_THREAD ? [`…and ${items.length - PREVIEWS_PER_THREAD} more.`] : [];
      paragraphs.push(`${items[0]!.subject} — ${countWords(items.length)}`, ...lines, ...more, `Reply: ${appUrl}/messages/${threadId}`);
    }
    return paragraphs;
  }

  function sendDigest(payload: DigestPayload): void {
    db.transaction((tx) => {
      const user = repo.findUser(payload.userId);
      if (!user || user.disabledAt) return;
      const pending = repo.undigestedUnread(user.id, tx);
      if (pending.length === 0) return;
      const groups = groupByThread(pending);
      // Marked even when muted: unmuting later must not mail a backlog of old messages.
      for (const [threadId, items] of groups) repo.setDigestedUntil(threadId, user.id, items.at(-1)!.message.createdAt, tx);
      if (notifications.isMuted(user.id, 'message_digest', tx)) return;
      const single = groups.size === 1 ? [...groups.keys()][0] : null;
      mailer.queue(
        composeMail({
          to: user.email,
          subject: `${countWords(pending.length)} on Kitlane`,
          greeting: `Hello ${user.displayName},`,
          paragraphs: [`While you were away, people wrote to you in ${groups.size === 1 ? 'one conversation' : `${groups.size} conversations`}:`, ...paragraphsFor(groups)],
          link: { label: single ? 'Open the conversation' : 'Open your messages', url: `${appUrl}/messages${single ? `/${single}` : ''}` },
          footer: unsubscribeFooter(appUrl, 'message_digest'),
        }),
        { db: tx },
      );
    });
  }

  jobs.register(DIGEST_JOB, (payload: DigestPayload) => sendDigest(payload));
  return scheduler;
}

function countWords(n: number): string {
  return n === 1 ? '1 unread message' : `${n} unread messages`;
}
