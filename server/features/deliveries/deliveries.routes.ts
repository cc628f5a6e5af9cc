import { Router, type Request, type Response } from 'express';
import { join, resolve } from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { AppContext } from '../../app';
import { requireSignedIn, requireUser } from '../../auth/middleware';
import { AppError, notFound } from '../../http/app-error';
import { bodyOf, validateBody } from '../../http/validate';
import type { Storage } from '../../storage/storage';
import {
  deliveryFileInputSchema,
  deliveryFileUpdateInputSchema,
  deliveryInputSchema,
  deliveryNoteInputSchema,
  requestChangesInputSchema,
} from '@shared/schemas/deliveries';
import { parseRange } from '../reels/http-range';
import { contentDisposition } from '../messages/content-disposition';
import { registerAbandonedUploadSweep } from './abandoned-uploads';
import { readDeliverySettings } from './deliveries.config';
import { createDeliveriesService } from './deliveries.service';
import { registerDeliveryJobs } from './delivery-jobs';
import { streamDeliveryZip } from './delivery-zip';
import { moneySeam } from './money-seam';
import { createUploadServer } from './tus-uploads';

const param = (req: Request, name: string) => String(req.params[name]);

/** Streams a stored file with byte ranges (players seek; big downloads resume). */
async function sendStored(req: Request, res: Response, storage: Storage, key: string, meta: { mime: string; disposition: string; cache: string }): Promise<void> {
  const info = await storage.stat(key);
  if (!info) throw notFound('That file');
  const answer = parseRange(req.get('range'), info.size);
  if (answer.kind === 'unsatisfiable') {
    throw new AppError('range_not_satisfiable', 'That byte range is outside the file', 416, undefined, { 'Content-Range': `bytes */${info.size}` });
  }
  const range = answer.kind === 'partial' ? { start: answer.start, end: answer.end } : undefined;
  res.set({ 'Accept-Ranges': 'bytes', 'Content-Type': meta.mime, 'Content-Disposition': meta.disposition, 'X-Content-Type-Options': 'nosniff', 'Cache-Control': meta.cache });
  if (range) res.status(206).set({ 'Content-Range': `bytes ${range.start}-${range.end}/${info.size}`, 'Content-Length': String(range.end - range.start + 1) });
  else res.status(200).set('Content-Length', String(info.size));
  if (req.method === 'HEAD') {
    res.end();
    return;
  }
  try {
    await pipeline(storage.get(key, range), res);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'ERR_STREAM_PREMATURE_CLOSE') throw error;
  }
}

export function deliveriesRoutes(ctx: AppContext): Router {
  const settings = readDeliverySettings();
  const service = createDeliveriesService(ctx, { settings, money: moneySeam(ctx) });
  registerDeliveryJobs(ctx, service, settings);
  // Unfinished uploads live beside the data, outside the storage namespace: only complete files enter it.
  const uploads = createUploadServer({
    dir: join(resolve(ctx.env.DATA_DIR), 'uploads-in-progress'),
    path: '/api/uploads',
    maxFileBytes: settings.maxFileBytes,
    authority: {
      authorize: (user, fileId, op) => service.authorizeUpload(user, fileId, op),
      complete: (fileId, localPath, sha256) => service.completeUpload(fileId, localPath, sha256),
    },
  });
  const dropUpload = async (fileId: string) => {
    uploads.store.forget(fileId);
    await uploads.store.remove(fileId).catch(() => undefined);
  };
  registerAbandonedUploadSweep(ctx, service, { dir: uploads.dir, olderThanMs: settings.abandonedUploadMs, dropUpload });

  const r = Router();
  r.use(['/bookings/:id/deliveries', '/deliveries'], requireSignedIn);

  // tus: creation (POST), offset (HEAD), bytes (PATCH), cancel (DELETE), capabilities (OPTIONS).
  r.route('/uploads{/:id}').post(uploads.handler).patch(uploads.handler).head(uploads.handler).delete(uploads.handler).options(uploads.handler);

  r.get('/bookings/:id/deliveries', (req, res) => {
    res.json(service.list(requireUser(res), param(req, 'id')));
  });

  r.post('/bookings/:id/deliveries', validateBody(deliveryInputSchema), (req, res) => {
    res.status(201).json({ delivery: service.create(requireUser(res), param(req, 'id'), bodyOf(res, deliveryInputSchema)) });
  });

  r.get('/deliveries/:id', (req, res) => {
    res.json({ delivery: service.viewOf(requireUser(res), param(req, 'id')) });
  });

  r.post('/deliveries/:id/files', validateBody(deliveryFileInputSchema), (req, res) => {
    res.status(201).json({ file: service.addFile(requireUser(res), param(req, 'id'), bodyOf(res, deliveryFileInputSchema)) });
  });

  r.patch('/deliveries/:id/files/:fileId', validateBody(deliveryFileUpdateInputSchema), (req, res) => {
    const { part } = bodyOf(res, deliveryFileUpdateInputSchema);
    res.json({ file: service.updateFile(requireUser(res), param(req, 'id'), param(req, 'fileId'), part) });
  });

  r.delete('/deliveries/:id/files/:fileId', async (req, res) => {
    await service.removeFile(requireUser(res), param(req, 'id'), param(req, 'fileId'), dropUpload);
    res.status(204).end();
  });

  r.post('/deliveries/:id/submit', (req, res) => {
    res.json({ delivery: service.submit(requireUser(res), param(req, 'id')) });
  });

  r.post('/deliveries/:id/notes', validateBody(deliveryNoteInputSchema), (req, res) => {
    res.status(201).json({ note: service.addNote(requireUser(res), param(req, 'id'), bodyOf(res, deliveryNoteInputSchema)) });
  });

  r.delete('/deliveries/:id/notes/:noteId', (req, res) => {
    service.removeNote(requireUser(res), param(req, 'id'), param(req, 'noteId'));
    res.status(204).end();
  });

  r.post('/deliveries/:id/request-changes', validateBody(requestChangesInputSchema), (req, res) => {
    res.json(service.requestChanges(requireUser(res), param(req, 'id'), bodyOf(res, requestChangesInputSchema)));
  });

  r.post('/deliveries/:id/accept', async (req, res) => {
    res.json({ delivery: await service.accept(requireUser(res), param(req, 'id')) });
  });

  r.get('/deliveries/:id/files/:fileId/preview', async (req, res) => {
    const { file, key } = service.fileFor(requireUser(res), param(req, 'id'), param(req, 'fileId'), 'preview');
    await sendStored(req, res, ctx.storage, key, { mime: 'audio/mpeg', disposition: `inline; filename="${file.id}.mp3"`, cache: 'private, max-age=3600' });
  });

  r.get('/deliveries/:id/files/:fileId/peaks', async (req, res) => {
    const { file, key } = service.fileFor(requireUser(res), param(req, 'id'), param(req, 'fileId'), 'peaks');
    await sendStored(req, res, ctx.storage, key, { mime: 'application/json', disposition: `inline; filename="${file.id}.peaks.json"`, cache: 'private, max-age=3600' });
  });

  r.get('/deliveries/:id/files/:fileId/original', async (req, res) => {
    const { file, key } = service.fileFor(requireUser(res), param(req, 'id'), param(req, 'fileId'), 'original');
    await sendStored(req, res, ctx.storage, key, { mime: 'audio/wav', disposition: contentDisposition(file.name), cache: 'private, no-store' });
  });

  r.get('/deliveries/:id/zip', async (_req, res) => {
    const { loaded, files, report } = service.zipOf(requireUser(res), param(_req, 'id'));
    await streamDeliveryZip(res, ctx.storage, loaded, files, report);
  });

  return r;
}
