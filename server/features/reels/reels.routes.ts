import { Router, type Response } from 'express';
import type { Readable } from 'node:stream';
import type { AppContext } from '../../app';
import { validateBody, bodyOf } from '../../http/validate';
import { AppError } from '../../http/app-error';
import { optionalUser, requireSignedIn, requireUser } from '../../auth/middleware';
import { receiveUpload } from '../../uploads/receive';
import { REEL_MAX_BYTES, reelOrderInputSchema, reelTrackFieldsInputSchema } from '@shared/schemas/reels';
import { createReelsRepository } from './reels.repository';
import { createReelsService } from './reels.service';
import { createProfilesRepository } from '../profiles/profiles.repository';
import { parseRange } from './http-range';

// Reels change rarely and each upload gets a new id, but a profile can be unpublished: cache briefly, privately.
const CACHE = 'private, max-age=300';

/** Pipes a file to the response; a listener who seeks or leaves closes the socket, which is not an error. */
function sendStream(res: Response, stream: Readable): void {
  res.on('close', () => stream.destroy());
  stream.on('error', () => {
    if (!res.headersSent) res.status(500).end();
    else res.destroy();
  });
  stream.pipe(res);
}

export function reelsRoutes(ctx: AppContext): Router {
  const reels = createReelsService({
    db: ctx.db,
    storage: ctx.storage,
    repo: createReelsRepository(ctx.db),
    profiles: createProfilesRepository(ctx.db),
    logger: ctx.logger,
  });
  const r = Router();
  // Reels are public to play; every private route starts with requireSignedIn, before any input is parsed.

  r.post('/reel-tracks', requireSignedIn, async (req, res) => {
    const user = requireUser(res);
    // Refuse before a 40 MB body is read from someone who may not upload at all.
    reels.assertMayUpload(user);
    const file = await receiveUpload(req, res, { field: 'file', maxBytes: REEL_MAX_BYTES, accept: ['wav', 'mp3'], label: 'reel track' });
    const fields = reelTrackFieldsInputSchema.safeParse(file.fields);
    if (!fields.success) {
      await file.discard();
      throw fields.error;
    }
    const kind = file.kind === 'wav' ? 'wav' : 'mp3';
    const track = await reels.addTrack(user, { tmpPath: file.tmpPath, kind, mime: file.mime, size: file.size }, fields.data);
    res.status(201).json({ track });
  });

  // Before /reel-tracks/:id so "order" is never read as an id.
  r.put('/reel-tracks/order', requireSignedIn, validateBody(reelOrderInputSchema), (_req, res) => {
    res.json({ tracks: reels.reorder(requireUser(res), bodyOf(res, reelOrderInputSchema)) });
  });

  r.delete('/reel-tracks/:id', requireSignedIn, async (req, res) => {
    await reels.deleteTrack(requireUser(res), String(req.params.id));
    res.status(204).end();
  });

  r.get('/reel-tracks/:id/audio', async (req, res) => {
    const { track, size } = await reels.openAudio(optionalUser(res), req.params.id);
    const range = parseRange(req.get('range'), size);
    if (range.kind === 'unsatisfiable') {
      throw new AppError('range_not_satisfiable', 'That byte range is outside the file', 416, undefined, { 'Content-Range': `bytes */${size}` });
    }
    res.set({
      'Accept-Ranges': 'bytes',
      'Content-Type': track.mime,
      'Content-Disposition': 'inline',
      'X-Content-Type-Options': 'nosniff',
      'Cache-Control': CACHE,
    });
    const part = range.kind === 'partial' ? { start: range.start, end: range.end } : undefined;
    if (part) res.status(206).set('Content-Range', `bytes ${part.start}-${part.end}/${size}`);
    res.set('Content-Length', String(part ? part.end - part.start + 1 : size));
    if (req.method === 'HEAD') {
      res.end();
      return;
    }
    sendStream(res, reels.audioStream(track, part));
  });

  r.get('/reel-tracks/:id/peaks', (req, res) => {
    const stream = reels.openPeaks(optionalUser(res), req.params.id);
    res.set({ 'Content-Type': 'application/json; charset=utf-8', 'X-Content-Type-Options': 'nosniff', 'Cache-Control': CACHE });
    sendStream(res, stream);
  });

  return r;
}
