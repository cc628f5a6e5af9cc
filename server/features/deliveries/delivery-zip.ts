import type { Response } from 'express';
import { pipeline } from 'node:stream/promises';
import { ZipArchive } from 'archiver';
import type { Storage } from '../../storage/storage';
import type { DeliveryCheckReport } from '@shared/schemas/delivery-check';
import type { DeliveryManifest } from '@shared/schemas/deliveries';
import { contentDisposition } from '../messages/content-disposition';
import type { DeliveryFileRow } from './deliveries.repository';
import type { Loaded } from './deliveries.service';

// The originals of a delivery as one zip, streamed: stored without compression (WAV barely compresses and
// deflating 400 MB would cost seconds of CPU for nothing), one file at a time from storage, with a manifest
// an engineer can verify the files against.

export function buildManifest(loaded: Loaded, files: DeliveryFileRow[], report: DeliveryCheckReport | null): DeliveryManifest {
  const stems = new Map((report?.stems ?? []).map((s) => [s.name, s]));
  return {
    booking: { id: loaded.booking.id, songTitle: loaded.booking.terms.songTitle },
    delivery: { id: loaded.delivery.id, number: loaded.delivery.number, submittedAt: loaded.delivery.submittedAt?.toISOString() ?? null },
    files: files.map((f) => {
      const stem = stems.get(f.name);
      return {
        name: f.name,
        part: f.part,
        sizeBytes: f.sizeBytes,
        sha256: f.sha256 ?? '',
        format: stem?.format ?? null,
        sampleRate: stem?.sampleRate ?? null,
        bitDepth: stem?.bitDepth ?? null,
        channels: stem?.channels ?? null,
        durationSec: stem?.durationSec ?? null,
      };
    }),
    check: { summary: report?.summary ?? null, level: report?.level ?? null },
  };
}

function zipName(loaded: Loaded): string {
  const title = loaded.booking.terms.songTitle.replace(/[^\w -]+/g, '').trim().replace(/\s+/g, '-') || 'delivery';
  return `${title}-v${loaded.delivery.number}-stems.zip`;
}

export async function streamDeliveryZip(res: Response, storage: Storage, loaded: Loaded, files: DeliveryFileRow[], report: DeliveryCheckReport | null): Promise<void> {
  const manifest = buildManifest(loaded, files, report);
  const zip = new ZipArchive({ store: true, forceZip64: files.reduce((sum, f) => sum + f.sizeBytes, 0) > 0xffff_ff00 });
  res.status(200).set({
    'Content-Type': 'application/zip',
    'Content-Disposition': contentDisposition(zipName(loaded)),
    'X-Content-Type-Options': 'nosniff',
    'Cache-Control': 'private, no-store',
  });
  zip.append(`${JSON.stringify(manifest, null, 2)}\n`, { name: 'manifest.json' });
  for (const f of files) zip.append(storage.get(f.storageKey!), { name: f.name, date: f.uploadedAt ?? undefined });
  const done = pipeline(zip, res);
  void zip.finalize();
  try {
    await done;
  } catch (error) {
    // The listener went away mid-download: nothing of ours failed.
    if ((error as NodeJS.ErrnoException).code !== 'ERR_STREAM_PREMATURE_CLOSE') throw error;
  }
}
