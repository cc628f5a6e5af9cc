// The delivery's background work, as jobs of the SQLite job runner so it survives a restart: a preview per
// file as soon as it is uploaded, and the delivery check (server/audio, worker pool) once all files are in.
// Both are idempotent: they recompute from the stored originals and write their result only if the
// delivery still looks the way it did when they started.
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdir, mkdtemp, rm } from 'node:fs/promises';
import { randomUUID } from 'node:crypto';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pipeline } from 'node:stream/promises';
import { and, eq, inArray } from 'drizzle-orm';
import type { AppContext } from '../../app';
import { deliveries, deliveryChecks, jobs as jobsTable } from '../../db/schema';
import { checkDelivery, type DeliveryFile } from '../../audio/check-delivery';
import { createCheckPool } from '../../audio/pool';
import { inTransaction } from '../briefs/in-transaction';
import { createBookingsRepository } from '../bookings/bookings.repository';
import { deliveriesRepo as repo, type DeliveryFileRow } from './deliveries.repository';
import { CHECK_JOB, PREVIEW_JOB, publicReport, storageKeys, type DeliveriesService } from './deliveries.service';
import { expectFor } from './check-expect';
import type { DeliverySettings } from './deliveries.config';
import { PreviewError, runPreview } from './previews/run-preview';

const PROGRESS_EVERY_MS = 250;

/** A local path for a stored file: the file itself on local disk, else a temporary copy. */
async function localFile(ctx: AppContext, key: string, scratch: string, name: string): Promise<string> {
  const direct = ctx.storage.localPath(key);
  if (direct) return direct;
  const copy = join(scratch, name);
  await pipeline(ctx.storage.get(key), createWriteStream(copy));
  return copy;
}

export function registerDeliveryJobs(ctx: AppContext, service: DeliveriesService, settings: DeliverySettings): void {
  // One process owns the SQLite file, so a check or preview still marked running at boot was cut off by a
  // crash or restart: run it again now instead of waiting out its lease.
  ctx.db
    .update(jobsTable)
    .set({ status: 'queued', lockedBy: null, lockedUntil: null, runAt: Date.now() })
    .where(and(inArray(jobsTable.kind, [CHECK_JOB, PREVIEW_JOB]), eq(jobsTable.status, 'running')))
    .run();
  const work = deliveryWork(ctx, service, settings);
  ctx.jobs.register(PREVIEW_JOB, work.preview);
  ctx.jobs.register(CHECK_JOB, work.check);
}

export type DeliveryWork = {
  preview(payload: { fileId: string }, at: { attempt: number }): Promise<void>;
  check(payload: { deliveryId: string; run: number }, at: { attempt: number }): Promise<void>;
};

/**
 * The job handlers as plain functions, so the demo seed can run them before the job runner starts; the
 * jobs it also enqueued find the work done and return (both handlers are idempotent).
 */
export function deliveryWork(ctx: AppContext, service: DeliveriesService, settings: DeliverySettings): DeliveryWork {
  const { db, storage } = ctx;
  const bookings = createBookingsRepository(db);

  const preview: DeliveryWork['preview'] = async ({ fileId }, { attempt }) => {
    const file = repo.file(db, fileId);
    if (!file || file.status !== 'uploaded' || !file.storageKey || file.previewStatus === 'ready') return;
    const scratch = await mkdtemp(join(tmpdir(), 'kitlane-preview-'));
    try {
      const source = await localFile(ctx, file.storageKey, scratch, 'original.wav');
      const target = join(scratch, 'preview.mp3');
      try {
        await runPreview({ source, target });
      } catch (error) {
        // An unreadable WAV never gets a preview; the check report says why. Other failures retry.
        if (attempt >= 3 || (error instanceof PreviewError && error.unreadable)) {
          markPreview(file, 'failed', null);
          return;
        }
        throw error;
      }
      const key = storageKeys.preview(file.deliveryId, file.id);
      await storage.put(key, createReadStream(target));
      markPreview(file, 'ready', key);
    } finally {
      await rm(scratch, { recursive: true, force: true });
    }
  };

  function markPreview(file: DeliveryFileRow, status: 'ready' | 'failed', key: string | null): void {
    inTransaction(db, (tx) => {
      if (!repo.file(tx, file.id)) return;
      repo.updateFile(tx, file.id, { previewStatus: status, previewKey: key });
      service.maybeReady(tx, file.deliveryId);
    });
  }

  const check: DeliveryWork['check'] = async ({ deliveryId, run }, { attempt }) => {
    const current = () => {
      const d = repo.delivery(db, deliveryId);
      return d && d.checkRun === run && !d.submittedAt ? d : null;
    };
    const delivery = current();
    if (!delivery) return;
    const booking = bookings.findById(delivery.bookingId);
    const files = repo.files(db, deliveryId);
    if (!booking || files.length === 0 || files.some((f) => f.status !== 'uploaded' || !f.storageKey)) return;

    let lastWrite = 0;
    const progress = (fraction: number, label: string, force = false) => {
      const now = Date.now();
      if (!force && now - lastWrite < PROGRESS_EVERY_MS) return;
      lastWrite = now;
      db.update(deliveries).set({ checkStatus: 'running', checkProgress: Math.min(1, Math.max(0, fraction)), checkLabel: label }).where(and(eq(deliveries.id, deliveryId), eq(deliveries.checkRun, run))).run();
    };
    progress(0, 'Starting the check', true);

    const scratch = await mkdtemp(join(tmpdir(), 'kitlane-check-'));
    const pool = createCheckPool({ maxThreads: settings.checkThreads });
    try {
      const input: DeliveryFile[] = [];
      for (const f of files) input.push({ path: await localFile(ctx, f.storageKey!, scratch, `${f.id}.wav`), name: f.name, part: f.part ?? undefined });
      const expect = expectFor(booking.terms, booking.inputList, files);
      const peaksDir = join(scratch, 'peaks');
      await mkdir(peaksDir);
      const report = await checkDelivery(input, expect, { pool, peaksDir, onProgress: (fraction, label) => progress(fraction * 0.95, label) });
      if (!current()) return;
      progress(0.97, 'Saving the waveforms', true);
      const peaksKeys = new Map<string, string>();
      for (const stem of report.stems) {
        const file = files.find((f) => f.name === stem.name);
        if (!file || !stem.peaksFile) continue;
        const key = storageKeys.peaks(deliveryId, file.id);
        await storage.put(key, createReadStream(stem.peaksFile));
        peaksKeys.set(file.id, key);
      }
      const stored = publicReport(report);
      inTransaction(db, (tx) => {
        const d = repo.delivery(tx, deliveryId);
        if (!d || d.checkRun !== run || d.submittedAt) return;
        tx.insert(deliveryChecks)
          .values({ id: randomUUID(), deliveryId, run, report: stored, level: stored.level, summary: stored.summary, createdAt: new Date() })
          .onConflictDoNothing()
          .run();
        for (const [fileId, key] of peaksKeys) repo.updateFile(tx, fileId, { peaksKey: key });
        repo.updateDelivery(tx, deliveryId, { checkStatus: 'done', checkProgress: 1, checkLabel: 'Done', checkError: null });
        service.maybeReady(tx, deliveryId);
      });
    } catch (error) {
      const message = error instanceof Error ? error.message : String(error);
      const final = attempt >= 3;
      db.update(deliveries)
        .set({ checkStatus: final ? 'failed' : 'waiting', checkError: final ? `The check could not run: ${message}` : `Retrying after: ${message}` })
        .where(and(eq(deliveries.id, deliveryId), eq(deliveries.checkRun, run)))
        .run();
      throw error;
    } finally {
      await pool.destroy();
      await rm(scratch, { recursive: true, force: true });
    }
  };

  return { preview, check };
}
