import { z } from 'zod';

// The delivery check report: what the engine measures per stem, per related pair, and the pass / warn /
// fail items a songwriter reads. Shared so the UI can validate and type what the server stores.

export const checkLevelSchema = z.enum(['pass', 'warn', 'fail']);
export type CheckLevel = z.infer<typeof checkLevelSchema>;

export const stemReportSchema = z.object({
  /** The path the file was read from. */
  file: z.string(),
  /** The display name (the uploaded file name). */
  name: z.string(),
  /** Part id (shared/stems/parts.ts), given or suggested from the name; null when unknown. */
  part: z.string().nullable(),
  /** Readable format, e.g. "WAV PCM (extensible)", "RF64 float". */
  format: z.string(),
  container: z.enum(['RIFF', 'RF64', 'BW64']),
  encoding: z.enum(['pcm', 'float']),
  sampleRate: z.number().int().positive(),
  bitDepth: z.number().int().positive(),
  channels: z.number().int().positive(),
  frames: z.number().int().nonnegative(),
  durationSec: z.number().nonnegative(),
  samplePeakDbfs: z.number().nullable(),
  truePeakDbtp: z.number().nullable(),
  integratedLufs: z.number().nullable(),
  rmsDbfs: z.number().nullable(),
  dcOffset: z.number(),
  clippedRuns: z.number().int().nonnegative(),
  clippedSamples: z.number().int().nonnegative(),
  /** Peak below −60 dBFS (digital silence included). */
  silent: z.boolean(),
  /** Every sample is exactly zero. */
  digitalSilence: z.boolean(),
  /** Energy below 30 Hz relative to the whole, in dB (DC excluded); null for a silent stem. */
  rumbleDb: z.number().nullable(),
  /** BWF TimeReference in samples since midnight at the file's rate; null without a bext chunk. */
  timeReference: z.number().int().nonnegative().nullable(),
  /** Where the waveform peaks JSON was written, when asked for. */
  peaksFile: z.string().nullable(),
});
export type StemReport = z.infer<typeof stemReportSchema>;

export const pairReportSchema = z.object({
  a: z.string(),
  b: z.string(),
  /** How the pair was chosen: two mics on one drum, a close mic against an overhead, or found by correlation. */
  kind: z.enum(['same_drum', 'close_overhead', 'correlated', 'requested']),
  /** Positive when b's sound arrives after a's. */
  lagSamples: z.number().int(),
  lagMs: z.number(),
  /** The extra path length the lag stands for at 343 m/s. */
  distanceCm: z.number(),
  /** Normalised band-limited (500 Hz–5 kHz) cross-correlation at the lag, signed. */
  correlation: z.number().min(-1).max(1),
  polarity: z.enum(['same', 'inverted']),
});
export type PairReport = z.infer<typeof pairReportSchema>;

export const checkItemSchema = z.object({
  id: z.string(),
  level: checkLevelSchema,
  /** Plain words a songwriter understands. */
  message: z.string(),
  /** What an engineer wants to know. */
  detail: z.string().optional(),
  files: z.array(z.string()),
});
export type CheckItem = z.infer<typeof checkItemSchema>;

export const unreadableFileSchema = z.object({ file: z.string(), name: z.string(), reason: z.string() });

export const deliveryCheckReportSchema = z.object({
  stems: z.array(stemReportSchema),
  pairs: z.array(pairReportSchema),
  checks: z.array(checkItemSchema),
  unreadable: z.array(unreadableFileSchema),
  /** One line for the top of the review room, e.g. "12 stems, 48 kHz / 24-bit, all aligned". */
  summary: z.string(),
  /** The worst level among the checks. */
  level: checkLevelSchema,
});
export type DeliveryCheckReport = z.infer<typeof deliveryCheckReportSchema>;

export const bitDepthInputSchema = z.union([z.number().int().positive(), z.literal('32f')]);

export const deliveryExpectInputSchema = z.object({
  sampleRate: z.number().int().positive().optional(),
  bitDepth: bitDepthInputSchema.optional(),
  tempo: z.number().positive().optional(),
  bars: z.number().positive().optional(),
  beatsPerBar: z.number().int().positive().optional(),
  pairs: z.array(z.object({ a: z.string(), b: z.string(), expectInverted: z.boolean().optional() })).optional(),
});
export type DeliveryExpectInput = z.infer<typeof deliveryExpectInputSchema>;

/** The waveform peaks file written per stem, drawable by a waveform view without decoding audio. */
export const waveformPeaksSchema = z.object({
  durationSec: z.number(),
  sampleRate: z.number(),
  levels: z.array(z.object({ samplesPerPixel: z.number().int().positive(), data: z.array(z.number().min(0).max(1)) })),
});
export type WaveformPeaks = z.infer<typeof waveformPeaksSchema>;
