import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeStem } from './analyze-stem';
import { StemMeter, type StemMeasures } from './stem-meter';
import { sine, writeWav } from './testing/synth-wav';
import { makeTempDir } from './testing/temp-dir';
import { TRUE_PEAK_HISTORY } from './true-peak';

const RATE = 48_000;
let temp: Awaited<ReturnType<typeof makeTempDir>>;

beforeAll(async () => {
  temp = await makeTempDir();
});
afterAll(async () => {
  await temp.cleanup();
});

function meterInBlocks(x: Float32Array, blockFrames: number, clipThreshold = 1 - 1e-6): StemMeasures {
  const meter = new StemMeter({ sampleRate: RATE, channels: 1, frames: x.length, clipThreshold, channelMask: null });
  const buffer = new Float32Array(TRUE_PEAK_HISTORY + Math.max(blockFrames, TRUE_PEAK_HISTORY));
  for (let at = 0; at < x.length; at += blockFrames) {
    const n = Math.min(blockFrames, x.length - at);
    buffer.set(x.subarray(at, at + n), TRUE_PEAK_HISTORY);
    meter.process([buffer], n);
    StemMeter.carryHistory([buffer], n);
  }
  return meter.finish([buffer]);
}

describe('StemMeter', () => {
  it('gives the same measures whatever the block size, across block boundaries', () => {
    const x = sine({ sampleRate: RATE, seconds: 3, freq: 331, amplitude: 0.7 });
    for (let i = 40_000; i < 40_600; i++) x[i] += 0.29 * Math.sin(i * 2.1);
    const small = meterInBlocks(x, 256);
    const large = meterInBlocks(x, 65_536);
    expect(small.samplePeak).toBe(large.samplePeak);
    expect(small.truePeak).toBeCloseTo(large.truePeak ?? 0, 6);
    expect(small.integratedLufs).toBeCloseTo(large.integratedLufs ?? 0, 6);
    expect(small.rumbleRatio).toBeCloseTo(large.rumbleRatio ?? 0, 6);
    expect(Array.from(small.peaks)).toEqual(Array.from(large.peaks));
  });

  it('counts only runs of 3 or more full-scale samples, also when a run crosses a block boundary', () => {
    const x = new Float32Array(2048).fill(0.1);
    x.fill(1, 100, 102); // 2 samples: not a run
    x.fill(-1, 300, 303); // 3 samples
    x.fill(1, 254, 259); // 5 samples across the first 256-frame block edge
    const m = meterInBlocks(x, 256);
    expect(m.clippedRuns).toBe(2);
    expect(m.clippedSamples).toBe(8);
  });

  it('measures a DC offset and keeps it out of the rumble figure', () => {
    const x = sine({ sampleRate: RATE, seconds: 2, freq: 1000, amplitude: 0.5 }).map((v) => v + 0.01);
    const m = meterInBlocks(x, 4096);
    expect(m.dcOffset).toBeCloseTo(0.01, 4);
    expect(10 * Math.log10(m.rumbleRatio ?? 1)).toBeLessThan(-40);
  });

  it('reads half the energy below 30 Hz as about −3 dB of rumble', () => {
    const low = sine({ sampleRate: RATE, seconds: 4, freq: 12, amplitude: 0.3 });
    const high = sine({ sampleRate: RATE, seconds: 4, freq: 1000, amplitude: 0.3 });
    const m = meterInBlocks(low.map((v, i) => v + high[i]), 8192);
    expect(10 * Math.log10(m.rumbleRatio ?? 0)).toBeCloseTo(-3, 0);
  });
});

describe('analyzeStem', () => {
  it('reports an all-zero stem as digital silence with no loudness and no rumble figure', async () => {
    const path = temp.path('empty.wav');
    await writeWav(path, [new Float32Array(RATE * 2)], { sampleRate: RATE, bits: 24 });
    const report = await analyzeStem(path);
    expect(report).toMatchObject({ silent: true, digitalSilence: true, samplePeakDbfs: null, integratedLufs: null, rumbleDb: null, clippedRuns: 0 });
  });

  it('suggests the part from the file name and reports the format in words', async () => {
    const path = temp.path('SN BOT.wav');
    await writeWav(path, [sine({ sampleRate: RATE, seconds: 1, freq: 200, amplitude: 0.25 })], { sampleRate: RATE, bits: 24, extensible: true });
    const report = await analyzeStem(path);
    expect(report.part).toBe('snare_bottom');
    expect(report.format).toBe('WAV PCM (extensible)');
    expect(report.samplePeakDbfs).toBeCloseTo(-12.04, 1);
    expect(report.rmsDbfs).toBeCloseTo(-15.05, 1);
  });
});
