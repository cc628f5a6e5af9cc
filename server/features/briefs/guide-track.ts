import { randomUUID } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { rm, writeFile } from 'node:fs/promises';
import { analyzeStem } from '../../audio/analyze-stem';
import { isWavError } from '../../audio/wav-errors';
import { AppError } from '../../http/app-error';
import type { Storage } from '../../storage/storage';
import type { ReceivedFile } from '../../uploads/receive';
import { mp3Peaks, Mp3DecodeError } from '../../audio/mp3-peaks';

export type StoredGuide = { audioKey: string; peaksKey: string; mime: string; name: string; durationSec: number };

const unreadable = (kind: string, detail: string) =>
  new AppError('unreadable_audio', `That ${kind.toUpperCase()} file could not be read: ${detail}`, 422, { file: 'The audio could not be read' });

/** Computes the waveform peaks once, beside the temp file; the browser then never decodes the audio to draw it. */
async function writePeaks(file: ReceivedFile, peaksPath: string): Promise<number> {
  try {
    if (file.kind === 'wav') return (await analyzeStem(file.tmpPath, { peaksOut: peaksPath })).durationSec;
    const peaks = await mp3Peaks(file.tmpPath);
    await writeFile(peaksPath, JSON.stringify(peaks));
    return peaks.durationSec;
  } catch (err) {
    if (isWavError(err) || err instanceof Mp3DecodeError) throw unreadable(file.kind, err.message);
    throw err;
  }
}

/**
 * Stores a checked guide track and its peaks under fresh keys. Peaks are computed before anything reaches
 * storage, and a failure half-way removes what was stored, so a failed upload leaves no file behind.
 */
export async function storeGuideTrack(storage: Storage, briefId: string, file: ReceivedFile): Promise<StoredGuide> {
  const id = randomUUID();
  const audioKey = `guides/${briefId}/${id}.${file.kind}`;
  const peaksKey = `guides/${briefId}/${id}.peaks.json`;
  const peaksPath = `${file.tmpPath}.peaks.json`;
  try {
    const durationSec = await writePeaks(file, peaksPath);
    await file.saveTo(storage, audioKey);
    try {
      await storage.put(peaksKey, createReadStream(peaksPath));
    } catch (err) {
      await storage.delete(audioKey);
      throw err;
    }
    return { audioKey, peaksKey, mime: file.mime, name: file.originalName || `guide.${file.kind}`, durationSec };
  } finally {
    await file.discard();
    await rm(peaksPath, { force: true });
  }
}

export async function deleteGuideFiles(storage: Storage, keys: (string | null)[]): Promise<void> {
  for (const key of keys) if (key) await storage.delete(key);
}
