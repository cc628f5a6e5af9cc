import { afterAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { computeWavPeaks, fitPeaks, samplesPerPixelFor } from './reel-peaks';
import { encodeWav16Mono } from '../../audio/wav-encode';
import { synthReelSamples } from './reel-synth';

const dir = mkdtempSync(join(tmpdir(), 'kitlane-reel-peaks-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('reel waveform peaks', () => {
  it('finds the loudest sample of each bucket and the exact duration', async () => {
    const sr = 44100;
    const samples = new Float32Array(sr); // one second of silence…
    samples[1000] = 0.5; // …with one click in bucket 3 (256 frames a bucket)
    samples[30_000] = -0.25; // and a negative one in bucket 117
    const path = join(dir, 'clicks.wav');
    writeFileSync(path, encodeWav16Mono(samples, sr));
    const peaks = await computeWavPeaks(path);
    const level = peaks.levels[0];
    expect(peaks.durationSec).toBe(1);
    expect(level.samplesPerPixel).toBe(256);
    expect(level.data).toHaveLength(Math.ceil(sr / 256));
    expect(level.data[Math.floor(1000 / 256)]).toBeCloseTo(0.5, 3);
    expect(level.data[Math.floor(30_000 / 256)]).toBeCloseTo(0.25, 3);
    expect(level.data.filter((v) => v > 0)).toHaveLength(2);
  });

  it('widens the buckets for long files so the peaks stay small', () => {
    expect(samplesPerPixelFor(44100 * 10)).toBe(256);
    expect(samplesPerPixelFor(44100 * 240, 4000)).toBe(Math.ceil((44100 * 240) / 4000));
  });

  it('draws the synthesised demo pattern with its normalised peak of 0.7', async () => {
    const path = join(dir, 'groove.wav');
    writeFileSync(path, encodeWav16Mono(synthReelSamples({ seconds: 8, tempo: 100, seed: 3 }), 44100));
    const peaks = await computeWavPeaks(path);
    expect(Math.max(...peaks.levels[0].data)).toBeCloseTo(0.7, 2);
    expect(peaks.durationSec).toBeCloseTo(8, 5);
  });

  it('narrows MP3 peaks to the point budget, keeping the loudest of each merged run', () => {
    const data = Array.from({ length: 10 }, (_, i) => i / 10);
    const fitted = fitPeaks({ durationSec: 1, sampleRate: 44100, levels: [{ samplesPerPixel: 256, data }, { samplesPerPixel: 4096, data: [0.9] }] }, 4);
    expect(fitted.levels).toHaveLength(1);
    expect(fitted.levels[0].samplesPerPixel).toBe(256 * 3);
    expect(fitted.levels[0].data).toEqual([0.2, 0.5, 0.8, 0.9]);
    expect(fitPeaks({ durationSec: 1, sampleRate: 44100, levels: [{ samplesPerPixel: 256, data: [0.1, 0.3] }] }, 4).levels[0]).toEqual({ samplesPerPixel: 256, data: [0.1, 0.3] });
  });

  it('refuses a file that is not a WAV', async () => {
    const path = join(dir, 'text.wav');
    writeFileSync(path, 'just some words pretending to be audio');
    await expect(computeWavPeaks(path)).rejects.toMatchObject({ name: 'WavError' });
  });
});
