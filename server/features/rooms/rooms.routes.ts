import { Router, type Request, type Response } from 'express';
import type { Readable } from 'node:stream';
import type { AppContext } from '../../app';
import { optionalUser, requireSignedIn, requireUser } from '../../auth/middleware';
import { bodyOf, queryOf, validateBody, validateQuery } from '../../http/validate';
import { notFound } from '../../http/app-error';
import { receiveUpload } from '../../uploads/receive';
import {
  ROOM_PHOTO_MAX_BYTES,
  blockedDatesInputSchema,
  roomInputSchema,
  roomPhotoFieldsInputSchema,
  roomSearchQuerySchema,
  roomUpdateInputSchema,
} from '@shared/schemas/rooms';
import { createRoomsService } from './rooms.service';

const idOf = (req: Request) => String(req.params.id);

/** Photos get a new id on every upload, so they can be cached; a room can be removed, so only briefly in shared caches. */
function sendPhoto(res: Response, stream: Readable): void {
  res.set({ 'Content-Type': 'image/webp', 'Content-Disposition': 'inline', 'X-Content-Type-Options': 'nosniff', 'Cache-Control': 'public, max-age=3600' });
  res.on('close', () => stream.destroy());
  stream.on('error', () => {
    if (!res.headersSent) res.status(404).json({ error: { code: 'not_found', message: 'That photo was not found' } });
    else res.destroy();
  });
  stream.pipe(res);
}

export function roomsRoutes(ctx: AppContext): Router {
  const rooms = createRoomsService(ctx);
  const r = Router();
  // Rooms are public to read; every private route starts with requireSignedIn, before any input is parsed.

  // Public search (DESIGN.md's fixed `GET /api/rooms?q=…` → {items, total}).
  r.get('/rooms', validateQuery(roomSearchQuerySchema), (_req, res) => {
    res.json(rooms.search(queryOf(res, roomSearchQuerySchema)));
  });

  // Before /rooms/:id so "mine" is never read as an id.
  r.get('/rooms/mine', requireSignedIn, (_req, res) => {
    res.json(rooms.listMine(requireUser(res)));
  });

  r.post('/rooms', requireSignedIn, validateBody(roomInputSchema), (_req, res) => {
    res.status(201).json({ room: rooms.create(requireUser(res), bodyOf(res, roomInputSchema)) });
  });

  r.get('/rooms/:id', (req, res) => {
    res.json({ room: rooms.get(optionalUser(res), idOf(req)) });
  });

  r.patch('/rooms/:id', requireSignedIn, validateBody(roomUpdateInputSchema), (req, res) => {
    res.json({ room: rooms.update(requireUser(res), idOf(req), bodyOf(res, roomUpdateInputSchema)) });
  });

  r.delete('/rooms/:id', requireSignedIn, (req, res) => {
    rooms.archive(requireUser(res), idOf(req));
    res.status(204).end();
  });

  r.get('/rooms/:id/acoustics', (req, res) => {
    res.json(rooms.acoustics(optionalUser(res), idOf(req)));
  });

  r.put('/rooms/:id/blocked-dates', requireSignedIn, validateBody(blockedDatesInputSchema), (req, res) => {
    res.json({ blockedDates: rooms.setBlockedDates(requireUser(res), idOf(req), bodyOf(res, blockedDatesInputSchema)) });
  });

  r.post('/rooms/:id/photos', requireSignedIn, async (req, res) => {
    const user = requireUser(res);
    // Refuse before a 10 MB body is read from someone who may not add a photo at all.
    rooms.assertMayAddPhoto(user, idOf(req));
    const file = await receiveUpload(req, res, { field: 'file', maxBytes: ROOM_PHOTO_MAX_BYTES, accept: ['jpg', 'png', 'webp'], label: 'photo' });
    const fields = roomPhotoFieldsInputSchema.safeParse(file.fields);
    if (!fields.success) {
      await file.discard();
      throw fields.error;
    }
    res.status(201).json({ photo: await rooms.addPhoto(user, idOf(req), { tmpPath: file.tmpPath }, fields.data.caption) });
  });

  r.delete('/rooms/:id/photos/:photoId', requireSignedIn, async (req, res) => {
    await rooms.deletePhoto(requireUser(res), idOf(req), String(req.params.photoId));
    res.status(204).end();
  });

  r.get('/rooms/:id/photos/:photoId/:size', (req, res) => {
    const size = req.params.size;
    if (size !== 'large' && size !== 'thumb') throw notFound('That photo size');
    sendPhoto(res, rooms.openPhoto(optionalUser(res), idOf(req), String(req.params.photoId), size));
  });

  return r;
}
