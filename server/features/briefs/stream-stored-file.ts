import type { Request, Response } from 'express';
import { pipeline } from 'node:stream/promises';
import { AppError, notFound } from '../../http/app-error';
import type { Storage } from '../../storage/storage';
// One range parser for every audio stream in the app (reels wrote it first).
import { parseRange } from '../reels/http-range';


/** Streams a stored file with range support, so audio players can seek without downloading it all. */
export async function streamStoredFile(
  req: Request,
  res: Response,
  storage: Storage,
  key: string,
  meta: { mime: string; fileName: string },
): Promise<void> {
  const info = await storage.stat(key);
  if (!info) throw notFound('That file');
  const answer = parseRange(req.get('range'), info.size);
  if (answer.kind === 'unsatisfiable') {
    throw new AppError('range_not_satisfiable', 'That byte range is outside the file', 416, undefined, { 'Content-Range': `bytes */${info.size}` });
  }
  const range = answer.kind === 'partial' ? { start: answer.start, end: answer.end } : null;
  res.set({
    'Accept-Ranges': 'bytes',
    'Content-Type': meta.mime,
    'Cache-Control': 'private, max-age=3600',
    'Content-Disposition': `inline; filename="${meta.fileName.replace(/[^\w. -]/g, '_')}"`,
  });
  if (range) {
    res.status(206).set({ 'Content-Range': `bytes ${range.start}-${range.end}/${info.size}`, 'Content-Length': String(range.end - range.start + 1) });
  } else {
    res.status(200).set('Content-Length', String(info.size));
  }
  if (req.method === 'HEAD') {
    res.end();
    return;
  }
  try {
    await pipeline(storage.get(key, range ?? undefined), res);
  } catch (err) {
    // A listener that stops playback closes the connection mid-file; that is not an error of ours.
    if ((err as NodeJS.ErrnoException).code !== 'ERR_STREAM_PREMATURE_CLOSE') throw err;
  }
}
