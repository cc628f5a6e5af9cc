// Uploads nobody finishes: a stem added to a delivery whose bytes stopped coming (the laptop closed, the
// drummer uploaded the file under another name) keeps a row that blocks the check and a tus part of up to
// 4 GiB in the uploads folder. A sweep removes both once nothing has been written for the configured time,
// and tus parts that no unfinished file owns any more (a crash between tus and the database).
import { readdir, rm, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { and, eq, lt } from 'drizzle-orm';
import type { AppContext } from '../../app';
import { deliveries, deliveryFiles } from '../../db/schema';
import { inTransaction } from '../briefs/in-transaction';
import type { DeliveriesService } from './deliveries.service';

export const ABANDONED_UPLOADS_JOB = 'deliveries.abandoned-uploads';
/** How often the sweep runs; the age limit itself is a setting (DELIVERY_ABANDONED_UPLOAD_HOURS). */
export const SWEEP_EVERY_MS = 60 * 60_000;

export type SweepOptions = {
  /** The tus file store's folder: a part is `<fileId>`, its metadata `<fileId>.json`. */
  dir: string;
  olderThanMs: number;
  /** Clears the upload server's state for a file (running hash) and its part. */
  dropUpload(fileId: string): Promise<void>;
  now?: number;
};

export type SweepResult = { filesRemoved: string[]; partsRemoved: string[] };

/** When the part (or its metadata) was last written; null when tus never created it. */
async function lastWrite(dir: string, fileId: string): Promise<number | null> {
  const times = await Promise.all([fileId, `${fileId}.json`].map((name) => stat(join(dir, name)).then((s) => s.mtimeMs, () => null)));
  const known = times.filter((t): t is number => t !== null);
  return known.length ? Math.max(...known) : null;
}

async function partNames(dir: string): Promise<string[]> {
  try {
    return await readdir(dir);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
}

export async function sweepAbandonedUploads(ctx: AppContext, service: Pick<DeliveriesService, 'maybeStartCheck'>, opts: SweepOptions): Promise<SweepResult> {
  const now = opts.now ?? Date.now();
  const cutoff = now - opts.olderThanMs;
  const { db } = ctx;
  // Candidates by creation time first (cheap); the part's last write then decides, so a slow upload that
  // is still moving is left alone however old its row is.
  const candidates = db
    .select({ id: deliveryFiles.id, deliveryId: deliveryFiles.deliveryId })
    .from(deliveryFiles)
    .innerJoin(deliveries, eq(deliveries.id, deliveryFiles.deliveryId))
    .where(and(eq(deliveryFiles.status, 'uploading'), lt(deliveryFiles.createdAt, new Date(cutoff))))
    .all();

  const filesRemoved: string[] = [];
  for (const file of candidates) {
    const written = await lastWrite(opts.dir, file.id);
    if (written !== null && written >= cutoff) continue;
    const removed = inTransaction(db, (tx) => {
      // Re-read inside the transaction: the last byte may have arrived since the select.
      const gone = tx
        .delete(deliveryFiles)
        .where(and(eq(deliveryFiles.id, file.id), eq(deliveryFiles.status, 'uploading')))
        .returning({ id: deliveryFiles.id })
        .get();
      // The remaining files may all be in now: the delivery's check starts without the abandoned one.
      if (gone) service.maybeStartCheck(tx, file.deliveryId);
      return !!gone;
    });
    if (!removed) continue;
    await opts.dropUpload(file.id);
    filesRemoved.push(file.id);
  }

  const partsRemoved: string[] = [];
  const owned = new Set(db.select({ id: deliveryFiles.id }).from(deliveryFiles).where(eq(deliveryFiles.status, 'uploading')).all().map((r) => r.id));
  for (const name of await partNames(opts.dir)) {
    const fileId = name.endsWith('.json') ? name.slice(0, -'.json'.length) : name;
    if (owned.has(fileId) || filesRemoved.includes(fileId)) continue;
    const written = await lastWrite(opts.dir, fileId);
    if (written === null || written >= cutoff) continue;
    await rm(join(opts.dir, name), { force: true });
    partsRemoved.push(name);
  }
  return { filesRemoved, partsRemoved };
}

/** Runs the sweep every hour as a job of the SQLite runner: one job per hour slot, each queueing the next. */
export function registerAbandonedUploadSweep(ctx: AppContext, service: Pick<DeliveriesService, 'maybeStartCheck'>, opts: Omit<SweepOptions, 'now'>): void {
  const enqueueNext = (after: number) => {
    const slot = Math.floor(after / SWEEP_EVERY_MS) + 1;
    ctx.jobs.enqueue(ABANDONED_UPLOADS_JOB, {}, { runAt: slot * SWEEP_EVERY_MS, dedupeKey: `${ABANDONED_UPLOADS_JOB}:${slot}`, maxAttempts: 3 });
  };
  ctx.jobs.register(ABANDONED_UPLOADS_JOB, async () => {
    try {
      const result = await sweepAbandonedUploads(ctx, service, opts);
      if (result.filesRemoved.length || result.partsRemoved.length) {
        ctx.logger.info(`removed ${result.filesRemoved.length} abandoned uploads and ${result.partsRemoved.length} orphaned upload parts`);
      }
    } finally {
      enqueueNext(Date.now());
    }
  });
  enqueueNext(Date.now());
}
