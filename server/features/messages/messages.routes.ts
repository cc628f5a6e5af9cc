import { Router, type Request, type Response } from 'express';
import { pipeline } from 'node:stream/promises';
import { ipKeyGenerator } from 'express-rate-limit';
import type { AppContext } from '../../app';
import { assertVerified, requireSignedIn, requireUser } from '../../auth/middleware';
import { validateBody, validateQuery, bodyOf, queryOf } from '../../http/validate';
import { limiter } from '../../http/rate-limit';
import { AppError } from '../../http/app-error';
import { receiveUpload, type ReceivedFile } from '../../uploads/receive';
import { fieldsOf } from '../../http/error-handler';
import { createMessagesRepository } from './messages.repository';
import { createMessagesService, type MessagesService } from './messages.service';
import { createDigests } from './messages.digest';
import { contentDisposition } from './content-disposition';
import {
  briefThreadInputSchema,
  listMessagesQuerySchema,
  messageBodySchema,
  sendMessageInputSchema,
  MESSAGE_ATTACHMENT_KINDS,
  MESSAGE_ATTACHMENT_MAX_BYTES,
} from '@shared/schemas/messages';
import type { UnreadCounts } from '@shared/schemas/notifications';

export function createMessagesFeature(ctx: AppContext): MessagesService {
  const repo = createMessagesRepository(ctx.db);
  const digests = createDigests({
    db: ctx.db,
    repo,
    jobs: ctx.jobs,
    mailer: ctx.mailer,
    notifications: ctx.notifications,
    appUrl: ctx.appUrl,
    delayMs: ctx.env.MESSAGE_DIGEST_DELAY_MS,
  });
  return createMessagesService({ db: ctx.db, repo, storage: ctx.storage, digests, logger: ctx.logger });
}

// Named route parameters are plain strings; the typings widen them once middleware sits in front.
const param = (req: Request, name: string): string => String(req.params[name]);

async function readMessageInput(req: Request, res: Response): Promise<{ body: string; attachment?: ReceivedFile }> {
  if (!req.is('multipart/form-data')) return bodyOf(res, sendMessageInputSchema);
  const attachment = await receiveUpload(req, res, {
    field: 'file',
    maxBytes: MESSAGE_ATTACHMENT_MAX_BYTES,
    accept: [...MESSAGE_ATTACHMENT_KINDS],
    label: 'attachment',
  });
  const parsed = messageBodySchema.safeParse(attachment.fields.body ?? '');
  if (!parsed.success) {
    await attachment.discard();
    throw new AppError('invalid_input', 'Some fields need attention', 400, fieldsOf(parsed.error));
  }
  return { body: parsed.data, attachment };
}

export function messagesRoutes(ctx: AppContext): Router {
  const service = createMessagesFeature(ctx);
  const r = Router();
  r.use(['/briefs/:briefId/thread', '/bookings/:bookingId/thread', '/threads', '/messages', '/unread'], requireSignedIn);
  // Per account when signed in, so people behind one address do not share a budget.
  const sendLimit = limiter('message', ctx.limits.messages, (req, res) => res.locals.user?.id ?? ipKeyGenerator(req.ip ?? ''));
  // JSON bodies are checked here; multipart ones after the upload, in readMessageInput.
  const jsonBodyOnly = (req: Request, res: Response, next: () => void) =>
    req.is('multipart/form-data') ? next() : validateBody(sendMessageInputSchema)(req, res, next);

  r.post('/briefs/:briefId/thread', validateBody(briefThreadInputSchema), (req, res) => {
    const thread = service.openBriefThread(requireUser(res), param(req, 'briefId'), bodyOf(res, briefThreadInputSchema));
    res.json({ thread });
  });

  r.post('/bookings/:bookingId/thread', (req, res) => {
    res.json({ thread: service.openBookingThread(requireUser(res), param(req, 'bookingId')) });
  });

  r.get('/threads', (_req, res) => {
    res.json({ items: service.listThreads(requireUser(res)) });
  });

  r.get('/threads/:threadId/messages', validateQuery(listMessagesQuerySchema), (req, res) => {
    const { after } = queryOf(res, listMessagesQuerySchema);
    res.json(service.listMessages(requireUser(res), param(req, 'threadId'), after));
  });

  r.post(
    '/threads/:threadId/messages',
    (_req, res, next) => {
      assertVerified(requireUser(res));
      next();
    },
    sendLimit,
    jsonBodyOnly,
    async (req, res) => {
      const user = requireUser(res);
      service.assertParticipant(user, param(req, 'threadId'));
      const message = await service.sendMessage(user, param(req, 'threadId'), await readMessageInput(req, res));
      res.status(201).json({ message });
    },
  );

  r.post('/threads/:threadId/read', (req, res) => {
    res.json(service.markThreadRead(requireUser(res), param(req, 'threadId')));
  });

  r.get('/messages/:messageId/attachment', async (req, res) => {
    const file = await service.openAttachment(requireUser(res), param(req, 'messageId'));
    res.set({
      'Content-Type': file.mime,
      'Content-Length': String(file.size),
      'Content-Disposition': contentDisposition(file.name),
      'X-Content-Type-Options': 'nosniff',
      'Cache-Control': 'private, no-store',
    });
    // A reader who goes away mid-download is not an error of ours; the answer has already started.
    await pipeline(file.stream, res).catch((err: unknown) => {
      if (!res.headersSent) throw err;
      ctx.logger.debug(`attachment download ended early: ${String(err)}`);
    });
  });

  r.get('/unread', (_req, res) => {
    const user = requireUser(res);
    const counts: UnreadCounts = { messages: service.unreadMessages(user), notifications: ctx.notifications.unreadCount(user.id) };
    res.json(counts);
  });

  return r;
}
