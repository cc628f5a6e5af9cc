import multer from 'multer';
import { mkdirSync, createReadStream } from 'node:fs';
import { rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import type { Request, Response } from 'express';
import { fileTypeFromFile } from 'file-type';
import { AppError } from '../http/app-error';
import type { Storage } from '../storage/storage';

export type AcceptedKind = 'wav' | 'mp3' | 'jpg' | 'png' | 'webp' | 'pdf' | 'txt';

const MIME: Record<AcceptedKind, string> = {
  wav: 'audio/wav',
  mp3: 'audio/mpeg',
  jpg: 'image/jpeg',
  png: 'image/png',
  webp: 'image/webp',
  pdf: 'application/pdf',
  txt: 'text/plain',
};

export type ReceivedFile = {
  tmpPath: string;
  originalName: string;
  size: number;
  kind: AcceptedKind;
  mime: string;
  /** Other multipart text fields that came with the file. */
  fields: Record<string, string>;
  /** Moves the file into storage under `key`; the temp file is removed either way. */
  saveTo(storage: Storage, key: string): Promise<void>;
  discard(): Promise<void>;
};

const TMP = join(tmpdir(), 'kitlane-uploads');

/**
 * Receives one multipart file: multer streams it to a temp file (never whole in memory), the size limit
 * answers 413, and the type is decided by the file's content (magic bytes), not by its name or claimed type.
 * Nothing reaches storage unless every check passed.
 */
export async function receiveUpload(
  req: Request,
  res: Response,
  opts: { field: string; maxBytes: number; accept: AcceptedKind[]; label: string },
): Promise<ReceivedFile> {
  mkdirSync(TMP, { recursive: true });
  const upload = multer({
    storage: multer.diskStorage({ destination: TMP, filename: (_r, _f, cb) => cb(null, randomUUID()) }),
    limits: { fileSize: opts.maxBytes, files: 1, fields: 20, fieldSize: 10_000 },
  }).single(opts.field);
  await new Promise<void>((resolve, reject) => upload(req, res, (err: unknown) => (err ? reject(mapMulterError(err, opts)) : resolve())));
  const file = req.file;
  if (!file) throw new AppError('file_missing', `Choose a ${opts.label} to upload`, 400, { [opts.field]: 'No file was sent' });
  const discard = () => rm(file.path, { force: true });
  const kind = await sniff(file.path);
  if (!kind || !opts.accept.includes(kind)) {
    await discard();
    const allowed = opts.accept.map((k) => k.toUpperCase()).join(' or ');
    throw new AppError('unsupported_file', `That file is not a ${allowed} file (checked by its content, not its name)`, 415, {
      [opts.field]: `Only ${allowed} files are accepted`,
    });
  }
  return {
    tmpPath: file.path,
    originalName: file.originalname.slice(0, 200),
    size: file.size,
    kind,
    mime: MIME[kind],
    fields: { ...(req.body as Record<string, string>) },
    async saveTo(storage, key) {
      try {
        await storage.put(key, createReadStream(file.path));
      } finally {
        await discard();
      }
    },
    discard,
  };
}

function mapMulterError(err: unknown, opts: { maxBytes: number; label: string; field: string }): unknown {
  const e = err as { code?: string };
  if (e.code === 'LIMIT_FILE_SIZE') {
    const mb = Math.round(opts.maxBytes / 1024 / 1024);
    return new AppError('too_large', `That ${opts.label} is larger than ${mb} MB`, 413, { [opts.field]: `At most ${mb} MB` });
  }
  if (e.code === 'LIMIT_UNEXPECTED_FILE') return new AppError('unexpected_file', `Send the file in the "${opts.field}" field`, 400);
  return err;
}

async function sniff(path: string): Promise<AcceptedKind | null> {
  const type = await fileTypeFromFile(path);
  if (type) {
    if (type.ext === 'wav') return 'wav';
    if (type.ext === 'mp3') return 'mp3';
    if (type.ext === 'jpg') return 'jpg';
    if (type.ext === 'png') return 'png';
    if (type.ext === 'webp') return 'webp';
    if (type.ext === 'pdf') return 'pdf';
    return null;
  }
  return (await looksLikeText(path)) ? 'txt' : null;
}

async function looksLikeText(path: string): Promise<boolean> {
  const { open } = await import('node:fs/promises');
  const fh = await open(path, 'r');
  try {
    const buf = Buffer.alloc(4096);
    const { bytesRead } = await fh.read(buf, 0, buf.length, 0);
    if (bytesRead === 0) return false;
    const chunk = buf.subarray(0, bytesRead);
    if (chunk.includes(0)) return false;
    return new TextDecoder('utf-8', { fatal: false }).decode(chunk).includes('\uFFFD') === false;
  } finally {
    await fh.close();
  }
}
