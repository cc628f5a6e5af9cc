import { z } from 'zod';

export const MESSAGE_BODY_MAX = 5000;
/** Attachments are for a lyric sheet, a chart, a screenshot or a short audio note — not for stems. */
export const MESSAGE_ATTACHMENT_MAX_BYTES = 5 * 1024 * 1024;
/** What the server accepts by content (the file's bytes decide, never its name). */
export const MESSAGE_ATTACHMENT_KINDS = ['pdf', 'png', 'jpg', 'webp', 'txt', 'wav', 'mp3'] as const;
export const MESSAGE_ATTACHMENT_ACCEPT = '.pdf,.png,.jpg,.jpeg,.webp,.txt,.wav,.mp3,application/pdf,image/png,image/jpeg,image/webp,text/plain,audio/wav,audio/mpeg';

const idSchema = z.string().trim().min(1, 'Missing id').max(100);

export const briefThreadInputSchema = z.strictObject({
  /** The songwriter names the drummer; a drummer leaves it out (or names themself). */
  drummerId: idSchema.optional(),
});
export type BriefThreadInput = z.infer<typeof briefThreadInputSchema>;

/**
 * The text of a message. It may be empty only when a file comes with it; the server checks that pair
 * (the form does too, with the file field in hand).
 */
export const messageBodySchema = z
  .string()
  .trim()
  .max(MESSAGE_BODY_MAX, `Keep a message under ${MESSAGE_BODY_MAX} characters`);

export const sendMessageInputSchema = z.strictObject({
  body: messageBodySchema.min(1, 'Write a message'),
});
export type SendMessageInput = z.infer<typeof sendMessageInputSchema>;

/** The composer's form: text, or a file with optional text (the file itself is checked by the server). */
export const messageFormSchema = z
  .object({ body: messageBodySchema, hasFile: z.boolean() })
  .refine((v) => v.body.length > 0 || v.hasFile, { path: ['body'], message: 'Write a message or attach a file' });
export type MessageFormInput = z.infer<typeof messageFormSchema>;

/** `after` is the createdAt of the newest message the client has (ISO string or epoch milliseconds). */
export const listMessagesQuerySchema = z.strictObject({
  after: z
    .union([
      z.iso.datetime({ offset: true }),
      z
        .string()
        .regex(/^\d{1,15}$/, 'Use an ISO date or epoch milliseconds')
        .transform(Number),
    ])
    .transform((v) => new Date(v))
    .optional(),
});
export type ListMessagesQuery = z.infer<typeof listMessagesQuerySchema>;

// What the API answers. Dates travel as ISO strings.
export type ThreadKind = 'brief' | 'booking';
export type ThreadParticipant = { id: string; displayName: string; role: 'songwriter' | 'drummer' | 'engineer' };

export type ThreadSummary = {
  id: string;
  kind: ThreadKind;
  subject: string;
  briefId: string | null;
  bookingId: string | null;
  participants: ThreadParticipant[];
  unread: number;
  lastMessage: { body: string; senderName: string; attachmentName: string | null; createdAt: string } | null;
  lastMessageAt: string | null;
  createdAt: string;
};

export type MessageAttachment = { name: string; mime: string; size: number; url: string };

export type MessageView = {
  id: string;
  threadId: string;
  senderId: string;
  senderName: string;
  body: string;
  attachment: MessageAttachment | null;
  createdAt: string;
};

export type ThreadDetail = Omit<ThreadSummary, 'lastMessage'>;
export type ThreadMessages = { thread: ThreadDetail; messages: MessageView[] };

/** A short single-line preview for the thread list and the digest mail. */
export function previewOf(body: string, max = 140): string {
  const oneLine = body.replace(/\s+/g, ' ').trim();
  return oneLine.length <= max ? oneLine : `${oneLine.slice(0, max - 1).trimEnd()}…`;
}
