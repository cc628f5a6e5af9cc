import { isWavError } from './wav-errors';
import { measureStem } from './analyze-stem';
import type { StemReport } from '@shared/schemas/delivery-check';

// One pool task = one stem. Errors come back as values: a thrown error would lose its WavError code
// on the way through the worker boundary, and an unreadable file is an answer, not a crash.

export interface StemTask {
  path: string;
  name: string;
  part: string | null;
  peaksOut?: string;
}

export type StemTaskResult =
  | { ok: true; report: StemReport; activity: Float32Array; truePeakSkippedFraction: number }
  | { ok: false; reason: string; code: string };

export async function runStemTask(task: StemTask): Promise<StemTaskResult> {
  try {
    const analysis = await measureStem(task.path, { name: task.name, part: task.part, peaksOut: task.peaksOut });
    return { ok: true, ...analysis };
  } catch (error) {
    if (isWavError(error)) return { ok: false, reason: error.message, code: error.code };
    return { ok: false, reason: `could not be checked (${error instanceof Error ? error.message : String(error)})`, code: 'internal' };
  }
}

export default runStemTask;
