import { writeFile } from 'node:fs/promises';
import { basename } from 'node:path';
import type { StemReport, WaveformPeaks } from '@shared/schemas/delivery-check';
import { suggestPart } from '@shared/stems/parts';
import { WavReader, type WavInfo } from './wav-reader';
import { PEAK_BUCKET, StemMeter, type StemMeasures } from './stem-meter';
import { TRUE_PEAK_HISTORY } from './true-peak';

// One pass over a stem: every measure is fed from the same decoded Float32 blocks, so the file is read
// exactly once, in large blocks, with a few MB of buffers whatever its length.

/** Peak below this is a near-silent stem. */
export const SILENT_DBFS = -60;
export const PEAK_LEVELS = [PEAK_BUCKET, PEAK_BUCKET * 16] as const;
const FLOAT_CLIP_EPSILON = 1e-6;

export interface StemAnalysis {
  report: StemReport;
  /** Largest |x| per PEAK_BUCKET frames: tells pairs.ts where both stems of a pair are playing. */
  activity: Float32Array;
  /** Fraction of 32-sample windows the true-peak bound let us skip (for the bench). */
  truePeakSkippedFraction: number;
}

export interface AnalyzeOptions {
  peaksOut?: string;
  name?: string;
  part?: string | null;
}

export function toDb(linear: number): number | null {
  return linear > 0 ? 20 * Math.log10(linear) : null;
}

function round(value: number | null, digits: number): number | null {
  if (value === null || !Number.isFinite(value)) return null;
  const scale = 10 ** digits;
  return Math.round(value * scale) / scale;
}

/** Full scale: the largest positive code for integers (the most negative one is beyond it), 1 − ε for float. */
export function clipThresholdFor(info: Pick<WavInfo, 'encoding' | 'validBits'>): number {
  if (info.encoding === 'float') return 1 - FLOAT_CLIP_EPSILON;
  const half = 2 ** (info.validBits - 1);
  return (half - 1) / half;
}

export function describeFormat(info: WavInfo): string {
  const container = info.container === 'RIFF' ? 'WAV' : info.container;
  const encoding = info.encoding === 'pcm' ? 'PCM' : 'float';
  return `${container} ${encoding}${info.extensible ? ' (extensible)' : ''}${info.bext ? ' with bext' : ''}`;
}

export function buildPeaks(activity: Float32Array, frames: number, sampleRate: number): WaveformPeaks {
  const fine = Array.from(activity, (v) => Math.round(Math.min(1, v) * 1000) / 1000);
  const ratio = PEAK_LEVELS[1] / PEAK_LEVELS[0];
  const coarse: number[] = [];
  for (let i = 0; i < fine.length; i += ratio) {
    let max = 0;
    for (let j = i; j < Math.min(fine.length, i + ratio); j++) if (fine[j] > max) max = fine[j];
    coarse.push(max);
  }
  return {
    durationSec: frames / sampleRate,
    sampleRate,
    levels: [
      { samplesPerPixel: PEAK_LEVELS[0], data: fine },
      { samplesPerPixel: PEAK_LEVELS[1], data: coarse },
    ],
  };
}

function toReport(path: string, info: WavInfo, m: StemMeasures, opts: AnalyzeOptions): StemReport {
  const name = opts.name ?? basename(path);
  return {
    file: path,
    name,
    part: opts.part === undefined ? suggestPart(name) : opts.part,
    format: describeFormat(info),
    container: info.container,
    encoding: info.encoding,
    sampleRate: info.sampleRate,
    bitDepth: info.validBits,
    channels: info.channels,
    frames: info.frames,
    durationSec: round(info.frames / info.sampleRate, 6) ?? 0,
    samplePeakDbfs: round(toDb(m.samplePeak), 2),
    truePeakDbtp: round(m.truePeak === null ? null : toDb(m.truePeak), 2),
    integratedLufs: round(m.integratedLufs, 2),
    rmsDbfs: round(m.meanSquare > 0 ? 10 * Math.log10(m.meanSquare) : null, 2),
    dcOffset: round(m.dcOffset, 6) ?? 0,
    clippedRuns: m.clippedRuns,
    clippedSamples: m.clippedSamples,
    silent: m.samplePeak < 10 ** (SILENT_DBFS / 20),
    digitalSilence: m.samplePeak === 0,
    rumbleDb: round(m.rumbleRatio === null || m.rumbleRatio <= 0 ? null : 10 * Math.log10(m.rumbleRatio), 1),
    timeReference: info.bext ? info.bext.timeReference : null,
    peaksFile: opts.peaksOut ?? null,
  };
}

/** Reads the whole stem once and measures everything; throws WavError when the file is unreadable. */
export async function measureStem(path: string, opts: AnalyzeOptions = {}): Promise<StemAnalysis> {
  const reader = await WavReader.open(path);
  try {
    const { info } = reader;
    const meter = new StemMeter({
      sampleRate: info.sampleRate,
      channels: info.channels,
      frames: info.frames,
      clipThreshold: clipThresholdFor(info),
      channelMask: info.channelMask,
    });
    // History in front of each block for the true-peak interpolator; room for its final zeros.
    const length = TRUE_PEAK_HISTORY + Math.max(reader.framesPerBlock, TRUE_PEAK_HISTORY);
    const buffers = Array.from({ length: info.channels }, () => new Float32Array(length));
    for (;;) {
      const frames = await reader.read(buffers, TRUE_PEAK_HISTORY);
      if (frames === 0) break;
      meter.process(buffers, frames);
      StemMeter.carryHistory(buffers, frames);
    }
    const measures = meter.finish(buffers);
    if (opts.peaksOut) await writeFile(opts.peaksOut, JSON.stringify(buildPeaks(measures.peaks, info.frames, info.sampleRate)));
    return {
      report: toReport(path, info, measures, opts),
      activity: measures.peaks,
      truePeakSkippedFraction: measures.truePeakSkippedFraction,
    };
  } finally {
    await reader.close();
  }
}

export async function analyzeStem(path: string, opts: { peaksOut?: string } = {}): Promise<StemReport> {
  return (await measureStem(path, opts)).report;
}
