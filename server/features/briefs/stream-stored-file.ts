import type { Request, Response } from 'express';
import { pipeline } from 'node:stream/promises';
import { AppError, notFound } from '../../http/app-error';
import type { Storage } from '../../storage/storage';

export type ByteRange = { start: number; end: number };

/**
 * Parses a single `Range: bytes=…` header (RFC 9110 §14.1.2) against a file of `size` bytes.
 * null = no usable range (send the whole file); 'unsatisfiable' = answer 416. Several ranges are
 * answered with the first one only: players ask for one range at a time.
 */
export function parseRange(header: string | undefined, size: number): ByteRange | null | 'unsatisfiable' {
  if (!header) return null;
  const m = /^bytes=(\d*)-(\d*)(?:,.*)?$/.exec(header.trim());
  if (!m || (m[1] === '' && m[2] === '')) return null;
  if (m[1] === '') {
    // A suffix range: the last N bytes.
    const n = Number(m[2]);
    if (n === 0) return 'unsatisfiable';
    return { start: Math.max(0, size - n), end: size - 1 };
  }
  const start = Number(m[1]);
  const end = m[2] === '' ? size - 1 : Math.min(Number(m[2]), size - 1);
  if (start >= size || end < start) return 'unsatisfiable';
  return { start, end };
}

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
  const range = parseRange(req.get('range'), info.size);
  if (range === 'unsatisfiable') {
    throw new AppError('range_not_satisfiable', 'That byte range is outside the file', 416, undefined, { 'Content-Range': `bytes */${info.size}` });
  }
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
