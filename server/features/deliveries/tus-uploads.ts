// Resumable stem uploads over the open tus protocol (docs/decisions/011-resumable-uploads.md): @tus/server
// with its file store, mounted at /api/uploads. The upload id is the delivery file's id, so every tus
// request is checked against that file's delivery and the signed-in user before tus touches the disk.
import { createHash, type Hash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { rm, stat } from 'node:fs/promises';
import type { IncomingMessage } from 'node:http';
import { join } from 'node:path';
import { Transform, type Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { Server } from '@tus/server';
import { FileStore } from '@tus/file-store';
import type { RequestHandler } from 'express';
import type { CurrentUser } from '../../auth/middleware';
import { requireUser } from '../../auth/middleware';
import { AppError } from '../../http/app-error';

type HashState = { hash: Hash; offset: number };

/**
 * The file store with a SHA-256 fed by the bytes as they are written. tus serialises requests per upload
 * (its lock), so one running hash per upload is enough. Node's hash state cannot be saved, so after a
 * restart, or when an interrupted request left the hash ahead of the bytes on disk, the hash is rebuilt
 * by reading the part already on disk once, and then continues with the new bytes.
 */
export class HashingFileStore extends FileStore {
  private readonly hashes = new Map<string, HashState>();

  constructor(private readonly dir: string) {
    super({ directory: dir });
  }

  pathOf(id: string): string {
    return join(this.dir, id);
  }

  override async write(readable: Readable, id: string, offset: number): Promise<number> {
    const state = await this.hashAt(id, offset);
    const tap = new Transform({
      transform(chunk: Buffer, _encoding, callback) {
        state.hash.update(chunk);
        state.offset += chunk.length;
        callback(null, chunk);
      },
    });
    readable.once('error', (error) => tap.destroy(error));
    try {
      return await super.write(readable.pipe(tap), id, offset);
    } finally {
      // The last chunk may have been hashed but not written when the client went away: start over then.
      const onDisk = await stat(this.pathOf(id)).then((s) => s.size, () => -1);
      if (onDisk !== state.offset) this.hashes.delete(id);
    }
  }

  /** The hex digest of the whole file; reads it once more only when the running hash was lost. */
  async digest(id: string, size: number): Promise<string> {
    const state = await this.hashAt(id, size);
    this.hashes.delete(id);
    return state.hash.digest('hex');
  }

  forget(id: string): void {
    this.hashes.delete(id);
  }

  private async hashAt(id: string, offset: number): Promise<HashState> {
    const known = this.hashes.get(id);
    if (known && known.offset === offset) return known;
    const state: HashState = { hash: createHash('sha256'), offset: 0 };
    if (offset > 0) {
      await pipeline(createReadStream(this.pathOf(id), { start: 0, end: offset - 1, highWaterMark: 1024 * 1024 }), async (source: AsyncIterable<Buffer>) => {
        for await (const chunk of source) {
          state.hash.update(chunk);
          state.offset += chunk.length;
        }
      });
    }
    this.hashes.set(id, state);
    return state;
  }
}

export type UploadAuthority = {
  /** Throws an AppError unless `user` may send bytes for this file now; returns its declared size. */
  authorize(user: CurrentUser, fileId: string, op: 'create' | 'write' | 'read' | 'cancel'): { sizeBytes: number };
  /** Moves the completed file into storage and records its hash; runs inside the upload's lock. */
  complete(fileId: string, localPath: string, sha256: string): Promise<void>;
};

/** tus reads hook errors as {status_code, body}; the body keeps our error shape. */
function tusError(error: unknown): never {
  if (error instanceof AppError) {
    throw { status_code: error.status, body: JSON.stringify({ error: { code: error.code, message: error.message } }) };
  }
  throw error;
}

export type UploadServer = { handler: RequestHandler; store: HashingFileStore; dir: string };

export function createUploadServer(opts: { dir: string; path: string; maxFileBytes: number; authority: UploadAuthority }): UploadServer {
  const store = new HashingFileStore(opts.dir);
  const users = new WeakMap<IncomingMessage, CurrentUser>();
  const userOf = (req: object): CurrentUser => {
    // srvx keeps the Node request the Express handler saw on `runtime.node.req`.
    const node = (req as { runtime?: { node?: { req?: IncomingMessage } } }).runtime?.node?.req;
    const user = node ? users.get(node) : undefined;
    if (!user) tusError(new AppError('unauthorized', 'Sign in to continue', 401));
    return user;
  };

  const tus = new Server({
    path: opts.path,
    datastore: store,
    relativeLocation: true,
    maxSize: opts.maxFileBytes,
    // The app is same-origin only; no CORS grants to other sites.
    allowedOrigins: [],
    namingFunction: async (req, metadata) => {
      const fileId = metadata?.fileId ?? '';
      if (!fileId) tusError(new AppError('file_missing', 'Create the file on the delivery first, then upload it with its fileId', 400));
      try {
        opts.authority.authorize(userOf(req), fileId, 'create');
      } catch (error) {
        tusError(error);
      }
      // A new POST for a file restarts it from zero: whatever an earlier attempt left is dropped.
      store.forget(fileId);
      await store.remove(fileId).catch(() => undefined);
      return fileId;
    },
    onUploadCreate: async (req, upload) => {
      try {
        const { sizeBytes } = opts.authority.authorize(userOf(req), upload.id, 'create');
        if (upload.size !== sizeBytes) throw new AppError('size_mismatch', `This file was announced as ${sizeBytes} bytes but the upload says ${upload.size ?? 'unknown'}`, 400);
      } catch (error) {
        tusError(error);
      }
      return {};
    },
    onIncomingRequest: async (req, uploadId) => {
      const op = req.method === 'DELETE' ? 'cancel' : req.method === 'PATCH' ? 'write' : req.method === 'POST' ? 'create' : 'read';
      try {
        opts.authority.authorize(userOf(req), uploadId, op);
      } catch (error) {
        tusError(error);
      }
    },
    onUploadFinish: async (_req, upload) => {
      const size = upload.size ?? upload.offset;
      const sha256 = await store.digest(upload.id, size);
      try {
        await opts.authority.complete(upload.id, store.pathOf(upload.id), sha256);
      } catch (error) {
        tusError(error);
      }
      // The bytes now live in storage; the tus record goes so a stale client cannot write to it again.
      await store.configstore.delete(upload.id).catch(() => undefined);
      await rm(store.pathOf(upload.id), { force: true });
      return {};
    },
  });
  const handler: RequestHandler = async (req, res) => {
    users.set(req, requireUser(res));
    // Express strips the /api mount from req.url; tus matches ids against the full path.
    req.url = req.originalUrl;
    await tus.handle(req, res);
  };
  return { handler, store, dir: opts.dir };
}
