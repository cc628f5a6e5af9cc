import { randomUUID } from 'node:crypto';
import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { notificationMutes, notifications, users, type NotificationKind } from '../../db/schema';
import type { Mailer } from '../../mail/outbox';
import { composeMail } from '../../mail/templates';
import {
  NOTIFICATION_KIND_LABELS,
  notificationSettingsPath,
  type NotificationItem,
  type NotificationList,
} from '@shared/schemas/notifications';

export type NotifyInput = {
  kind: NotificationKind;
  title: string;
  body?: string;
  /** An app path like /briefs/123; mails link to appUrl + link. */
  link: string;
  /** Paragraphs for the mail; without them the body is used. */
  mailParagraphs?: string[];
  /** Skip the mail (the digest job mails messages itself). */
  inAppOnly?: boolean;
};

// The db or a transaction handle from db.transaction(): callers notify inside their own transaction.
type Queryable = Pick<Db, 'select'>;
type Writable = Pick<Db, 'select' | 'insert'>;

/** Every mail that reports something ends with a way to stop that kind of mail (issue 3). */
export function unsubscribeFooter(appUrl: string, kind: NotificationKind): string {
  return `To stop mails about "${NOTIFICATION_KIND_LABELS[kind].toLowerCase()}", open ${appUrl}${notificationSettingsPath(kind)} — you will still see them under the bell in Kitlane.`;
}

function toItem(row: typeof notifications.$inferSelect): NotificationItem {
  return {
    id: row.id,
    kind: row.kind,
    title: row.title,
    body: row.body,
    link: row.link,
    readAt: row.readAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}

/**
 * One place that tells people things: an in-app notification (the bell) and, unless the person muted
 * that kind, a mail through the outbox. Call it inside the same transaction as the change it reports
 * (pass `tx`), so a rolled-back change never notifies.
 */
export function createNotifications(deps: { db: Db; mailer: Mailer; appUrl: string }) {
  const { db, mailer, appUrl } = deps;

  function isMuted(tx: Queryable, userId: string, kind: NotificationKind): boolean {
    return !!tx
      .select()
      .from(notificationMutes)
      .where(and(eq(notificationMutes.userId, userId), eq(notificationMutes.kind, kind)))
      .get();
  }

  function unreadCount(userId: string): number {
    return db
      .select({ n: sql<number>`count(*)` })
      .from(notifications)
      .where(and(eq(notifications.userId, userId), isNull(notifications.readAt)))
      .get()!.n;
  }

  return {
    notify(userId: string, input: NotifyInput, tx: Writable = db): void {
      tx.insert(notifications)
        .values({ id: randomUUID(), userId, kind: input.kind, title: input.title, body: input.body ?? '', link: input.link, createdAt: new Date() })
        .run();
      if (input.inAppOnly || isMuted(tx, userId, input.kind)) return;
      const user = tx.select({ email: users.email, displayName: users.displayName }).from(users).where(eq(users.id, userId)).get();
      if (!user) return;
      mailer.queue(
        composeMail({
          to: user.email,
          subject: input.title,
          greeting: `Hello ${user.displayName},`,
          paragraphs: input.mailParagraphs ?? (input.body ? [input.body] : []),
          link: { label: 'Open in Kitlane', url: appUrl + input.link },
          footer: unsubscribeFooter(appUrl, input.kind),
        }),
        { db: tx },
      );
    },

    /** Whether `userId` asked not to be mailed about `kind` (the digest job asks before it mails). */
    isMuted(userId: string, kind: NotificationKind, tx: Queryable = db): boolean {
      return isMuted(tx, userId, kind);
    },

    list(userId: string, limit = 30): NotificationList {
      const items = db.select().from(notifications).where(eq(notifications.userId, userId)).orderBy(desc(notifications.createdAt)).limit(limit).all();
      return { items: items.map(toItem), unread: unreadCount(userId) };
    },

    unreadCount,

    /** Marks one (or, without id, every unread) notification of `userId` read; returns how many matched. */
    markRead(userId: string, id?: string): number {
      const mine = eq(notifications.userId, userId);
      // Re-reading an already read one keeps its first read time.
      const result = db
        .update(notifications)
        .set({ readAt: sql`coalesce(${notifications.readAt}, ${Date.now()})` })
        .where(id ? and(mine, eq(notifications.id, id)) : and(mine, isNull(notifications.readAt)))
        .run();
      return result.changes;
    },

    mutedKinds(userId: string): NotificationKind[] {
      return db.select().from(notificationMutes).where(eq(notificationMutes.userId, userId)).all().map((r) => r.kind);
    },

    setMuted(userId: string, kinds: NotificationKind[]): void {
      db.transaction((tx) => {
        tx.delete(notificationMutes).where(eq(notificationMutes.userId, userId)).run();
        for (const kind of new Set(kinds)) tx.insert(notificationMutes).values({ userId, kind }).run();
      });
    },
  };
}
export type Notifications = ReturnType<typeof createNotifications>;
