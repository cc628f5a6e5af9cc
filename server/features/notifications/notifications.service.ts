import { randomUUID } from 'node:crypto';
import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { notificationMutes, notifications, users, type NotificationKind } from '../../db/schema';
import type { Mailer } from '../../mail/outbox';
import { composeMail } from '../../mail/templates';

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

/**
 * One place that tells people things: an in-app notification (the bell) and, unless the person muted
 * that kind, a mail through the outbox. Call it inside the same transaction as the change it reports
 * (pass `tx`), so a rolled-back change never notifies.
 */
export function createNotifications(deps: { db: Db; mailer: Mailer; appUrl: string }) {
  const { db, mailer, appUrl } = deps;

  function isMuted(tx: Db, userId: string, kind: NotificationKind): boolean {
    return !!tx
      .select()
      .from(notificationMutes)
      .where(and(eq(notificationMutes.userId, userId), eq(notificationMutes.kind, kind)))
      .get();
  }

  return {
    notify(userId: string, input: NotifyInput, tx: Db = db): void {
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
          footer: `You can stop these mails under Account → Notifications (${appUrl}/account#notifications).`,
        }),
        { db: tx },
      );
    },

    list(userId: string, limit = 30) {
      const items = db.select().from(notifications).where(eq(notifications.userId, userId)).orderBy(desc(notifications.createdAt)).limit(limit).all();
      const unread = db
        .select({ n: sql<number>`count(*)` })
        .from(notifications)
        .where(and(eq(notifications.userId, userId), isNull(notifications.readAt)))
        .get()!.n;
      return { items, unread };
    },

    markRead(userId: string, id?: string): void {
      const mine = eq(notifications.userId, userId);
      db.update(notifications)
        .set({ readAt: new Date() })
        .where(id ? and(mine, eq(notifications.id, id)) : and(mine, isNull(notifications.readAt)))
        .run();
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
