import FFT from 'fft.js';
import { butterworthHighPass, butterworthLowPass, filterInPlace, type Biquad } from './filters';
import { PEAK_BUCKET } from './stem-meter';
import type { WavReader } from './wav-reader';

// Time offset and relative polarity of two related stems from their cross-correlation within ±10 ms.
// Both signals are band-limited to 500 Hz–5 kHz first: the low end of a drum rings for many periods,
// so a full-band correlation has broad side peaks and picks the wrong one on snare pairs.
//
// Memory stays small: instead of keeping whole signals, the analysis pass leaves a peak envelope per
// stem; here we pick a few short windows where both stems are playing, re-read only those, and sum the
// windows' cross-spectra before one inverse FFT.

export const SPEED_OF_SOUND_M_S = 343;
export const MAX_LAG_MS = 10;
const BAND_LOW_HZ = 500;
const BAND_HIGH_HZ = 5000;
// Short windows around hits: 0.15 s plus the ±10 ms margin fits an 8192-point FFT at 48 kHz.
const WINDOW_SECONDS = 0.15;
const WINDOWS = 6;
const MIN_WINDOW_GAP_SECONDS = 1;
// A window counts only where both stems reach this fraction of their own peak (−40 dB).
const MIN_ACTIVITY = 0.01;
// Settling time for the band-pass before the part we correlate.
const PREROLL_SECONDS = 0.02;

export interface PairSide {
  reader: WavReader;
  activity: Float32Array;
}

export interface PairMeasure {
  /** Positive when b's sound arrives after a's. */
  lagSamples: number;
  lagMs: number;
  distanceCm: number;
  /** Normalised band-limited correlation at the lag, signed. */
  correlation: number;
  polarity: 'same' | 'inverted';
  /** True when the best lag sits on the ±10 ms edge: the real offset may be larger. */
  atEdge: boolean;
  windows: number;
}

function nextPowerOfTwo(n: number): number {
  let p = 2;
  while (p < n) p *= 2;
  return p;
}

function maxOf(values: Float32Array): number {
  let max = 0;
  for (let i = 0; i < values.length; i++) if (values[i] > max) max = values[i];
  return max;
}

/** Start frames of up to WINDOWS windows where both envelopes are strongest, at least a second apart. */
export function chooseWindows(a: Float32Array, b: Float32Array, windowFrames: number, sampleRate: number, totalFrames: number, margin: number): number[] {
  const buckets = Math.min(a.length, b.length);
  const width = Math.max(1, Math.round(windowFrames / PEAK_BUCKET));
  const maxA = maxOf(a);
  const maxB = maxOf(b);
  if (maxA === 0 || maxB === 0 || buckets < width) return [];
  const score = new Float64Array(buckets);
  for (let i = 0; i < buckets; i++) score[i] = Math.min(a[i] / maxA, b[i] / maxB);
  const windowScore = new Float64Array(buckets - width + 1);
  let running = 0;
  for (let i = 0; i < buckets; i++) {
    running += score[i];
    if (i >= width) running -= score[i - width];
    if (i >= width - 1) windowScore[i - width + 1] = running / width;
  }
  const gap = Math.round((MIN_WINDOW_GAP_SECONDS * sampleRate) / PEAK_BUCKET);
  const chosen: number[] = [];
  // A few passes of "best remaining start at least a gap away from the chosen ones": cheaper than a sort.
  while (chosen.length < WINDOWS) {
    let best = -1;
    let bestScore = MIN_ACTIVITY;
    for (let i = 0; i < windowScore.length; i++) {
      if (windowScore[i] < bestScore) continue;
      if (chosen.some((c) => Math.abs(c - i) < gap)) continue;
      best = i;
      bestScore = windowScore[i];
    }
    if (best === -1) break;
    chosen.push(best);
  }
  // Convert to frames, keeping room for the lag margin and the filter pre-roll on both sides.
  const lastStart = totalFrames - windowFrames - margin;
  return chosen
    .map((bucket) => Math.min(Math.max(bucket * PEAK_BUCKET, margin), lastStart))
    .filter((start) => start >= margin && start <= lastStart);
}

async function readMonoBand(reader: WavReader, start: number, frames: number, band: Biquad[]): Promise<Float64Array> {
  const channels = reader.info.channels;
  const buffers = Array.from({ length: channels }, () => new Float32Array(frames));
  await reader.readWindow(start, frames, buffers);
  const mono = new Float64Array(frames);
  for (const channel of buffers) for (let i = 0; i < frames; i++) mono[i] += channel[i] / channels;
  filterInPlace(mono, band);
  return mono;
}

export function bandPass(sampleRate: number): Biquad[] {
  const high = Math.min(BAND_HIGH_HZ, sampleRate * 0.45);
  return [...butterworthHighPass(sampleRate, BAND_LOW_HZ, 4), ...butterworthLowPass(sampleRate, high, 2)];
}

/**
 * Measures b against a. Both stems must share a sample rate (the caller checks). Returns null when
 * there is no stretch where both are playing.
 */
export async function measurePair(a: PairSide, b: PairSide): Promise<PairMeasure | null> {
  const sampleRate = a.reader.info.sampleRate;
  const maxLag = Math.ceil((MAX_LAG_MS / 1000) * sampleRate);
  const preroll = Math.ceil(PREROLL_SECONDS * sampleRate);
  const windowFrames = Math.ceil((WINDOW_SECONDS * sampleRate) / PEAK_BUCKET) * PEAK_BUCKET;
  const totalFrames = Math.min(a.reader.info.frames, b.reader.info.frames);
  const margin = maxLag + preroll;
  const starts = chooseWindows(a.activity, b.activity, windowFrames, sampleRate, totalFrames, margin);
  if (starts.length === 0) return null;

  const size = nextPowerOfTwo(windowFrames + 2 * maxLag + 1);
  const fft = new FFT(size);
  const band = bandPass(sampleRate);
  const spectrumA = fft.createComplexArray();
  const spectrumB = fft.createComplexArray();
  const cross = new Float64Array(size * 2);
  const padA = new Float64Array(size);
  const padB = new Float64Array(size);
  const lags = 2 * maxLag + 1;
  const energyB = new Float64Array(lags);
  let energyA = 0;

  for (const start of starts) {
    const readStart = start - maxLag - preroll;
    const readFrames = preroll + windowFrames + 2 * maxLag;
    const sa = await readMonoBand(a.reader, readStart, readFrames, band);
    const sb = await readMonoBand(b.reader, readStart, readFrames, band);
    padA.fill(0);
    padB.fill(0);
    // a: the window itself; b: the window widened by maxLag each side, so every lag is a full overlap.
    padA.set(sa.subarray(preroll + maxLag, preroll + maxLag + windowFrames));
    padB.set(sb.subarray(preroll, preroll + windowFrames + 2 * maxLag));
    for (let i = 0; i < windowFrames; i++) energyA += padA[i] * padA[i];
    let sliding = 0;
    for (let i = 0; i < windowFrames; i++) sliding += padB[i] * padB[i];
    for (let k = 0; k < lags; k++) {
      energyB[k] += sliding;
      sliding += padB[k + windowFrames] ** 2 - padB[k] ** 2;
    }
    fft.realTransform(spectrumA, padA);
    fft.completeSpectrum(spectrumA);
    fft.realTransform(spectrumB, padB);
    fft.completeSpectrum(spectrumB);
    // Σ a[n]·b[n+k] ↔ conj(A)·B.
    for (let i = 0; i < size * 2; i += 2) {
      const ar = spectrumA[i], ai = spectrumA[i + 1], br = spectrumB[i], bi = spectrumB[i + 1];
      cross[i] += ar * br + ai * bi;
      cross[i + 1] += ar * bi - ai * br;
    }
  }

  const correlation = fft.createComplexArray();
  fft.inverseTransform(correlation, cross);
  let bestK = 0;
  let best = 0;
  for (let k = 0; k < lags; k++) {
    const denominator = Math.sqrt(energyA * energyB[k]);
    const rho = denominator > 0 ? correlation[2 * k] / denominator : 0;
    if (Math.abs(rho) > Math.abs(best)) {
      best = rho;
      bestK = k;
    }
  }
  const lagSamples = bestK - maxLag;
  const lagMs = (lagSamples / sampleRate) * 1000;
  return {
    lagSamples,
    lagMs: Math.round(lagMs * 1000) / 1000,
    distanceCm: Math.round(lagMs * SPEED_OF_SOUND_M_S) / 10,
    correlation: Math.max(-1, Math.min(1, Math.round(best * 1000) / 1000)),
    polarity: best < 0 ? 'inverted' : 'same',
    atEdge: bestK === 0 || bestK === lags - 1,
    windows: starts.length,
  };
}
