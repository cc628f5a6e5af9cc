import { and, asc, desc, eq, gt, inArray, isNull, ne, or, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { bookings, briefs, messages, quotes, threadParticipants, threads, users } from '../../db/schema';

export type ThreadRow = typeof threads.$inferSelect;
export type MessageRow = typeof messages.$inferSelect;
/** A transaction handle or the db itself: repository calls work in both. */
type Tx = Pick<Db, 'select' | 'insert' | 'update'>;

/** The people a thread belongs to, as stored on the brief or booking it is about. */
export type ThreadParties = { songwriterId: string | null; engineerId: string | null };

// "Unread for me": written by someone else after I last opened the thread.
const unreadFor = (userId: string) =>
  and(
    ne(messages.senderId, userId),
    or(isNull(threadParticipants.lastReadAt), gt(messages.createdAt, threadParticipants.lastReadAt)),
  );

export function createMessagesRepository(db: Db) {
  return {
    findBrief(id: string) {
      return db
        .select({ id: briefs.id, songwriterId: briefs.songwriterId, status: briefs.status, songTitle: briefs.songTitle })
        .from(briefs)
        .where(eq(briefs.id, id))
        .get();
    },

    findBooking(id: string) {
      return db
        .select({
          id: bookings.id,
          songwriterId: bookings.songwriterId,
          drummerId: bookings.drummerId,
          engineerId: bookings.engineerId,
          songTitle: briefs.songTitle,
        })
        .from(bookings)
        .innerJoin(briefs, eq(briefs.id, bookings.briefId))
        .where(eq(bookings.id, id))
        .get();
    },

    findUser(id: string) {
      return db
        .select({ id: users.id, displayName: users.displayName, email: users.email, roles: users.roles, disabledAt: users.disabledAt })
        .from(users)
        .where(eq(users.id, id))
        .get();
    },

    findBriefThread(briefId: string, drummerId: string, tx: Tx = db) {
      return tx
        .select()
        .from(threads)
        .where(and(eq(threads.briefId, briefId), eq(threads.drummerId, drummerId)))
        .get();
    },

    findBookingThread(bookingId: string, tx: Tx = db) {
      return tx.select().from(threads).where(eq(threads.bookingId, bookingId)).get();
    },

    findThread(id: string, tx: Tx = db) {
      return tx.select().from(threads).where(eq(threads.id, id)).get();
    },

    /** Inserts unless the (brief, drummer) or booking thread already exists; the unique indexes decide. */
    insertThreadIfAbsent(row: typeof threads.$inferInsert, tx: Tx = db): void {
      tx.insert(threads).values(row).onConflictDoNothing().run();
    },

    addParticipants(threadId: string, userIds: string[], tx: Tx = db): void {
      for (const userId of new Set(userIds)) {
        tx.insert(threadParticipants).values({ threadId, userId }).onConflictDoNothing().run();
      }
    },

    participant(threadId: string, userId: string, tx: Tx = db) {
      return tx
        .select()
        .from(threadParticipants)
        .where(and(eq(threadParticipants.threadId, threadId), eq(threadParticipants.userId, userId)))
        .get();
    },

    /** Who owns the brief or booking behind each thread, so each participant can be given a role. */
    partiesOf(threadIds: string[]): Map<string, ThreadParties> {
      if (threadIds.length === 0) return new Map();
      const rows = db
        .select({
          threadId: threads.id,
          briefOwner: briefs.songwriterId,
          bookingSongwriter: bookings.songwriterId,
          bookingEngineer: bookings.engineerId,
        })
        .from(threads)
        .leftJoin(briefs, eq(briefs.id, threads.briefId))
        .leftJoin(bookings, eq(bookings.id, threads.bookingId))
        .where(inArray(threads.id, threadIds))
        .all();
      return new Map(
        rows.map((r) => [r.threadId, { songwriterId: r.bookingSongwriter ?? r.briefOwner, engineerId: r.bookingEngineer }]),
      );
    },

    participantsOf(threadIds: string[]) {
      if (threadIds.length === 0) return [];
      return db
        .select({ threadId: threadParticipants.threadId, id: users.id, displayName: users.displayName })
        .from(threadParticipants)
        .innerJoin(users, eq(users.id, threadParticipants.userId))
        .where(inArray(threadParticipants.threadId, threadIds))
        .orderBy(asc(users.displayName))
        .all();
    },

    /** My threads, newest activity first, each with how many messages I have not read. */
    threadsOf(userId: string, limit: number) {
      return db
        .select({
          thread: threads,
          unread: sql<number>`(select count(*) from ${messages} where ${messages.threadId} = ${threads.id} and ${unreadFor(userId)})`,
        })
        .from(threadParticipants)
        .innerJoin(threads, eq(threads.id, threadParticipants.threadId))
        .where(eq(threadParticipants.userId, userId))
        .orderBy(desc(sql`coalesce(${threads.lastMessageAt}, ${threads.createdAt})`), desc(threads.id))
        .limit(limit)
        .all();
    },

    unreadIn(threadId: string, userId: string): number {
      return db
        .select({ n: sql<number>`count(*)` })
        .from(messages)
        .innerJoin(threadParticipants, and(eq(threadParticipants.threadId, messages.threadId), eq(threadParticipants.userId, userId)))
        .where(and(eq(messages.threadId, threadId), unreadFor(userId)))
        .get()!.n;
    },

    unreadTotal(userId: string): number {
      return db
        .select({ n: sql<number>`count(*)` })
        .from(messages)
        .innerJoin(threadParticipants, and(eq(threadParticipants.threadId, messages.threadId), eq(threadParticipants.userId, userId)))
        .where(unreadFor(userId))
        .get()!.n;
    },

    /** The newest message of each thread, with its sender's name. */
    lastMessagesOf(threadIds: string[]) {
      if (threadIds.length === 0) return [];
      const newest = sql`(select m2.id from ${messages} m2 where m2.thread_id = ${messages.threadId} order by m2.created_at desc, m2.id desc limit 1)`;
      return db
        .select({ message: messages, senderName: users.displayName })
        .from(messages)
        .innerJoin(users, eq(users.id, messages.senderId))
        .where(and(inArray(messages.threadId, threadIds), eq(messages.id, newest)))
        .all();
    },

    /** Oldest first; `after` for polling, otherwise the most recent `limit` messages. */
    messagesOf(threadId: string, opts: { after?: Date; limit: number }) {
      const base = db
        .select({ message: messages, senderName: users.displayName })
        .from(messages)
        .innerJoin(users, eq(users.id, messages.senderId));
      if (opts.after) {
        return base
          .where(and(eq(messages.threadId, threadId), gt(messages.createdAt, opts.after)))
          .orderBy(asc(messages.createdAt), asc(messages.id))
          .limit(opts.limit)
          .all();
      }
      return base
        .where(eq(messages.threadId, threadId))
        .orderBy(desc(messages.createdAt), desc(messages.id))
        .limit(opts.limit)
        .all()
        .reverse();
    },

    findMessage(id: string) {
      return db.select().from(messages).where(eq(messages.id, id)).get();
    },

    insertMessage(row: typeof messages.$inferInsert, tx: Tx = db): void {
      tx.insert(messages).values(row).run();
    },

    touchThread(threadId: string, at: Date, tx: Tx = db): void {
      tx.update(threads).set({ lastMessageAt: at }).where(eq(threads.id, threadId)).run();
    },

    markRead(threadId: string, userId: string, at: Date, tx: Tx = db): void {
      tx.update(threadParticipants)
        .set({ lastReadAt: at })
        .where(and(eq(threadParticipants.threadId, threadId), eq(threadParticipants.userId, userId)))
        .run();
    },

    /**
     * Messages a digest to `userId` should carry: unread, and newer than what an earlier digest already
     * mailed. Grouped later by thread.
     */
    undigestedUnread(userId: string, tx: Tx = db) {
      return tx
        .select({ message: messages, senderName: users.displayName, subject: threads.subject })
        .from(messages)
        .innerJoin(threadParticipants, and(eq(threadParticipants.threadId, messages.threadId), eq(threadParticipants.userId, userId)))
        .innerJoin(threads, eq(threads.id, messages.threadId))
        .innerJoin(users, eq(users.id, messages.senderId))
        .where(
          and(
            unreadFor(userId),
            or(isNull(threadParticipants.digestedUntil), gt(messages.createdAt, threadParticipants.digestedUntil)),
          ),
        )
        .orderBy(asc(messages.createdAt))
        .all();
    },

    /** For the demo seed: published briefs, oldest first, with the drummers who quoted on each. */
    talkableBriefs(limit: number) {
      const rows = db
        .select({ id: briefs.id, songwriterId: briefs.songwriterId })
        .from(briefs)
        .where(inArray(briefs.status, ['open', 'hired']))
        .orderBy(asc(briefs.publishedAt), asc(briefs.id))
        .limit(limit)
        .all();
      return rows.map((b) => ({
        ...b,
        quotedBy: db.select({ drummerId: quotes.drummerId }).from(quotes).where(eq(quotes.briefId, b.id)).orderBy(asc(quotes.createdAt)).all().map((q) => q.drummerId),
      }));
    },

    /** For the demo seed: bookings, oldest first. */
    someBookings(limit: number) {
      return db.select({ id: bookings.id, songwriterId: bookings.songwriterId, drummerId: bookings.drummerId, engineerId: bookings.engineerId }).from(bookings).orderBy(asc(bookings.createdAt)).limit(limit).all();
    },

    setDigestedUntil(threadId: string, userId: string, at: Date, tx: Tx = db): void {
      tx.update(threadParticipants)
        .set({ digestedUntil: at })
        .where(and(eq(threadParticipants.threadId, threadId), eq(threadParticipants.userId, userId)))
        .run();
    },
  };
}
export type MessagesRepository = ReturnType<typeof createMessagesRepository>;
