import type { WaveformPeaks } from '@shared/schemas/delivery-check';
import { WavReader } from '../../audio/wav-reader';

// A reel needs only a picture of its loudness over time, so this is one light streaming pass (largest
// |sample| per bucket over all channels) rather than the delivery check's full metering.

/** Enough points for a full-width waveform at 2× pixel density; more only costs bytes. */
export const REEL_PEAK_POINTS = 4000;
const MIN_SAMPLES_PER_PIXEL = 256;

export function samplesPerPixelFor(frames: number, maxPoints = REEL_PEAK_POINTS): number {
  return Math.max(MIN_SAMPLES_PER_PIXEL, Math.ceil(frames / maxPoints));
}

/** Streams a WAV file once and returns its peaks; throws WavError when the file is not a readable WAV. */
export async function computeWavPeaks(path: string, maxPoints = REEL_PEAK_POINTS): Promise<WaveformPeaks> {
  const reader = await WavReader.open(path);
  try {
    const { frames, sampleRate, channels } = reader.info;
    const spp = samplesPerPixelFor(frames, maxPoints);
    const data = new Array<number>(Math.ceil(frames / spp)).fill(0);
    const buffers = Array.from({ length: channels }, () => new Float32Array(reader.framesPerBlock));
    let frame = 0;
    for (;;) {
      const n = await reader.read(buffers);
      if (n === 0) break;
      for (const channel of buffers) accumulate(channel, n, frame, spp, data);
      frame += n;
    }
    return {
      durationSec: sampleRate > 0 ? frames / sampleRate : 0,
      sampleRate,
      levels: [{ samplesPerPixel: spp, data: data.map((v) => Math.round(Math.min(1, v) * 1000) / 1000) }],
    };
  } finally {
    await reader.close();
  }
}

function accumulate(channel: Float32Array, n: number, firstFrame: number, spp: number, into: number[]): void {
  for (let i = 0; i < n; i++) {
    const v = Math.abs(channel[i]);
    const bucket = Math.floor((firstFrame + i) / spp);
    if (v > into[bucket]) into[bucket] = v;
  }
}

/**
 * Narrows peaks made elsewhere (the MP3 decoder's fine level) to at most maxPoints, keeping the loudest
 * value of each merged run, so an MP3 reel draws like a WAV one and its peaks file stays small.
 */
export function fitPeaks(peaks: WaveformPeaks, maxPoints = REEL_PEAK_POINTS): WaveformPeaks {
  const fine = peaks.levels[0];
  const factor = Math.max(1, Math.ceil(fine.data.length / maxPoints));
  const data: number[] = [];
  for (let i = 0; i < fine.data.length; i += factor) {
    let max = 0;
    for (let j = i; j < Math.min(fine.data.length, i + factor); j++) if (fine.data[j] > max) max = fine.data[j];
    data.push(max);
  }
  return { durationSec: peaks.durationSec, sampleRate: peaks.sampleRate, levels: [{ samplesPerPixel: fine.samplesPerPixel * factor, data }] };
}
