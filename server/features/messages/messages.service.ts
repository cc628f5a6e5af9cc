import { randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import type { Db } from '../../db/client';
import type { threads } from '../../db/schema';
import type { CurrentUser } from '../../auth/middleware';
import { AppError, notFound } from '../../http/app-error';
import type { Storage } from '../../storage/storage';
import type { ReceivedFile } from '../../uploads/receive';
import type { Logger } from '../../logger';
import type { MessagesRepository, MessageRow, ThreadParties, ThreadRow } from './messages.repository';
import type { DigestScheduler } from './messages.digest';
import type { BriefThreadInput, MessageView, ThreadDetail, ThreadMessages, ThreadParticipant, ThreadSummary } from '@shared/schemas/messages';
import { previewOf } from '@shared/schemas/messages';

/** Brief states in which a drummer can see the brief, and so may talk about it (issue 3). */
const TALKABLE_BRIEF_STATES = new Set(['open', 'hired']);
const THREAD_LIST_LIMIT = 100;
const MESSAGE_PAGE_LIMIT = 200;

export type SendOptions = {
  /** The seed writes history: a past time, and no digest mail for it. */
  sentAt?: Date;
  digest?: boolean;
};

export type AttachmentDownload = { stream: Readable; name: string; mime: string; size: number };

type NewThread = typeof threads.$inferInsert;

// A thread that is not yours answers exactly like one that does not exist: its existence is not shared.
const threadNotFound = () => notFound('That conversation');

export function createMessagesService(deps: {
  db: Db;
  repo: MessagesRepository;
  storage: Storage;
  digests: DigestScheduler;
  logger: Logger;
}) {
  const { db, repo, storage, digests, logger } = deps;

  function roleIn(userId: string, parties: ThreadParties | undefined): ThreadParticipant['role'] {
    if (parties?.songwriterId === userId) return 'songwriter';
    if (parties?.engineerId === userId) return 'engineer';
    return 'drummer';
  }

  function participantsByThread(threadIds: string[]): Map<string, ThreadParticipant[]> {
    const parties = repo.partiesOf(threadIds);
    const byThread = new Map<string, ThreadParticipant[]>();
    for (const p of repo.participantsOf(threadIds)) {
      const list = byThread.get(p.threadId) ?? [];
      list.push({ id: p.id, displayName: p.displayName, role: roleIn(p.id, parties.get(p.threadId)) });
      byThread.set(p.threadId, list);
    }
    return byThread;
  }

  function detailOf(thread: ThreadRow, userId: string): ThreadDetail {
    return {
      id: thread.id,
      kind: thread.kind,
      subject: thread.subject,
      briefId: thread.briefId,
      bookingId: thread.bookingId,
      participants: participantsByThread([thread.id]).get(thread.id) ?? [],
      unread: repo.unreadIn(thread.id, userId),
      lastMessageAt: thread.lastMessageAt?.toISOString() ?? null,
      createdAt: thread.createdAt.toISOString(),
    };
  }

  function messageView(row: MessageRow, senderName: string): MessageView {
    return {
      id: row.id,
      threadId: row.threadId,
      senderId: row.senderId,
      senderName,
      body: row.body,
      attachment:
        row.attachmentKey && row.attachmentName && row.attachmentMime
          ? { name: row.attachmentName, mime: row.attachmentMime, size: row.attachmentSize ?? 0, url: `/api/messages/${row.id}/attachment` }
          : null,
      createdAt: row.createdAt.toISOString(),
    };
  }

  function threadOfParticipant(user: CurrentUser, threadId: string): ThreadRow {
    const thread = repo.findThread(threadId);
    if (!thread || !repo.participant(threadId, user.id)) throw threadNotFound();
    return thread;
  }

  /** Get-or-create in one synchronous transaction; the unique indexes make a second create a no-op. */
  function getOrCreate(find: () => ThreadRow | undefined, create: Omit<NewThread, 'id' | 'createdAt'>, participantIds: string[]): ThreadRow {
    return db.transaction((tx) => {
      const existing = find();
      if (existing) {
        // A party added later (say, an engineer on the booking) joins the existing thread.
        repo.addParticipants(existing.id, participantIds, tx);
        return existing;
      }
      const id = randomUUID();
      repo.insertThreadIfAbsent({ ...create, id, createdAt: new Date() }, tx);
      const thread = find()!;
      repo.addParticipants(thread.id, participantIds, tx);
      return thread;
    });
  }

  function drummerForBriefThread(user: CurrentUser, brief: { songwriterId: string }, input: BriefThreadInput): string {
    if (brief.songwriterId === user.id) {
      if (!input.drummerId) throw new AppError('drummer_required', 'Name the drummer you want to write to', 400, { drummerId: 'Choose a drummer' });
      if (input.drummerId === user.id) throw new AppError('own_brief', 'You cannot start a conversation with yourself', 400, { drummerId: 'Choose another drummer' });
      const drummer = repo.findUser(input.drummerId);
      if (!drummer || drummer.disabledAt || !drummer.roles.includes('drummer')) throw notFound('That drummer');
      return drummer.id;
    }
    // Anyone else must be a drummer asking about the brief for themself; otherwise the brief "does not exist".
    if (!user.roles.includes('drummer') || (input.drummerId && input.drummerId !== user.id)) throw notFound('That brief');
    return user.id;
  }

  return {
    /** POST /briefs/:id/thread — the conversation between the brief's songwriter and one drummer. */
    openBriefThread(user: CurrentUser, briefId: string, input: BriefThreadInput): ThreadDetail {
      const brief = repo.findBrief(briefId);
      const isOwner = brief?.songwriterId === user.id;
      // Drafts are invisible to everyone but their owner.
      if (!brief || (!isOwner && brief.status === 'draft')) throw notFound('That brief');
      const drummerId = drummerForBriefThread(user, brief, input);
      // A conversation that already exists stays reachable when the brief is later withdrawn or closed.
      if (!repo.findBriefThread(briefId, drummerId) && !TALKABLE_BRIEF_STATES.has(brief.status)) {
        if (isOwner) throw new AppError('brief_not_open', 'Only a published brief can be discussed with drummers', 409);
        throw notFound('That brief');
      }
      const thread = getOrCreate(
        () => repo.findBriefThread(briefId, drummerId),
        { kind: 'brief', briefId, drummerId, bookingId: null, subject: brief.songTitle },
        [brief.songwriterId, drummerId],
      );
      return detailOf(thread, user.id);
    },

    /** POST /bookings/:id/thread — songwriter, drummer and (when there is one) engineer. */
    openBookingThread(user: CurrentUser, bookingId: string): ThreadDetail {
      const booking = repo.findBooking(bookingId);
      const parties = booking ? [booking.songwriterId, booking.drummerId, booking.engineerId].filter((id): id is string => !!id) : [];
      if (!booking || !parties.includes(user.id)) throw notFound('That booking');
      const thread = getOrCreate(
        () => repo.findBookingThread(bookingId),
        { kind: 'booking', briefId: null, drummerId: null, bookingId, subject: booking.songTitle },
        parties,
      );
      return detailOf(thread, user.id);
    },

    listThreads(user: CurrentUser): ThreadSummary[] {
      const rows = repo.threadsOf(user.id, THREAD_LIST_LIMIT);
      const ids = rows.map((r) => r.thread.id);
      const participants = participantsByThread(ids);
      const last = new Map(repo.lastMessagesOf(ids).map((r) => [r.message.threadId, r]));
      return rows.map(({ thread, unread }) => {
        const newest = last.get(thread.id);
        return {
          id: thread.id,
          kind: thread.kind,
          subject: thread.subject,
          briefId: thread.briefId,
          bookingId: thread.bookingId,
          participants: participants.get(thread.id) ?? [],
          unread,
          lastMessage: newest
            ? {
                body: previewOf(newest.message.body),
                senderName: newest.senderName,
                attachmentName: newest.message.attachmentName,
                createdAt: newest.message.createdAt.toISOString(),
              }
            : null,
          lastMessageAt: thread.lastMessageAt?.toISOString() ?? null,
          createdAt: thread.createdAt.toISOString(),
        };
      });
    },

    listMessages(user: CurrentUser, threadId: string, after?: Date): ThreadMessages {
      const thread = threadOfParticipant(user, threadId);
      const rows = repo.messagesOf(threadId, { after, limit: MESSAGE_PAGE_LIMIT });
      return { thread: detailOf(thread, user.id), messages: rows.map((r) => messageView(r.message, r.senderName)) };
    },

    /** Checked before an upload is received, so someone outside the thread cannot even fill the temp dir. */
    assertParticipant(user: CurrentUser, threadId: string): void {
      threadOfParticipant(user, threadId);
    },

    async sendMessage(user: CurrentUser, threadId: string, input: { body: string; attachment?: ReceivedFile }, opts: SendOptions = {}): Promise<MessageView> {
      const { attachment } = input;
      try {
        threadOfParticipant(user, threadId);
        if (!input.body && !attachment) throw new AppError('invalid_input', 'Write a message or attach a file', 400, { body: 'Write a message' });
      } catch (err) {
        await attachment?.discard();
        throw err;
      }
      const id = randomUUID();
      const key = attachment ? `messages/${id}.${attachment.kind}` : null;
      if (attachment && key) await attachment.saveTo(storage, key);
      try {
        const row = db.transaction((tx) => {
          const thread = repo.findThread(threadId, tx)!;
          // Strictly increasing per thread, so polling with ?after=<last createdAt> never skips a message.
          const wanted = (opts.sentAt ?? new Date()).getTime();
          const createdAt = new Date(Math.max(wanted, (thread.lastMessageAt?.getTime() ?? 0) + 1));
          const message: MessageRow = {
            id,
            threadId,
            senderId: user.id,
            body: input.body,
            attachmentKey: key,
            attachmentName: attachment ? attachment.originalName || `attachment.${attachment.kind}` : null,
            attachmentMime: attachment?.mime ?? null,
            attachmentSize: attachment?.size ?? null,
            createdAt,
          };
          repo.insertMessage(message, tx);
          repo.touchThread(threadId, createdAt, tx);
          // Writing in a thread means having read it up to here.
          repo.markRead(threadId, user.id, createdAt, tx);
          if (opts.digest !== false) {
            for (const p of repo.participantsOf([threadId])) if (p.id !== user.id) digests.schedule(p.id, createdAt, tx);
          }
          return message;
        });
        return messageView(row, user.displayName);
      } catch (err) {
        // The row never committed: do not keep an orphan file.
        if (key) await storage.delete(key).catch((e: unknown) => logger.error(`could not remove orphan attachment ${key}`, e));
        throw err;
      }
    },

    async openAttachment(user: CurrentUser, messageId: string): Promise<AttachmentDownload> {
      const message = repo.findMessage(messageId);
      if (!message || !repo.participant(message.threadId, user.id) || !message.attachmentKey) throw notFound('That attachment');
      const stat = await storage.stat(message.attachmentKey);
      if (!stat) throw notFound('That attachment');
      return {
        stream: storage.get(message.attachmentKey),
        name: message.attachmentName ?? 'attachment',
        mime: message.attachmentMime ?? 'application/octet-stream',
        size: stat.size,
      };
    },

    markThreadRead(user: CurrentUser, threadId: string): { unread: number } {
      const thread = threadOfParticipant(user, threadId);
      // Read up to the newest message there is, not up to the clock: a message sent in the same millisecond
      // just after this read is stamped later than the thread's newest one, so it still counts as unread.
      const at = thread.lastMessageAt ?? new Date(0);
      repo.markRead(threadId, user.id, at);
      return { unread: repo.unreadTotal(user.id) };
    },

    unreadMessages(user: CurrentUser): number {
      return repo.unreadTotal(user.id);
    },
  };
}
export type MessagesService = ReturnType<typeof createMessagesService>;
