import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeStem } from '../../server/audio/analyze-stem';
import { concat, dbToGain, sine, writeWav } from '../../server/audio/testing/synth-wav';
import { makeTempDir } from '../../server/audio/testing/temp-dir';

// EBU Tech 3341 (v4, 2023) minimum requirements for loudness meters, tolerance ±0.1 LU: the test
// signals are synthesised here from the standard's description. Cases 1, 2 and the −18 dBFS
// calibration are in REFERENCES.md; cases 3–6 are written down from memory of the document's table.
const RATE = 48_000;
let temp: Awaited<ReturnType<typeof makeTempDir>>;

beforeAll(async () => {
  temp = await makeTempDir();
});
afterAll(async () => {
  await temp.cleanup();
});

function tone(db: number, seconds: number): Float32Array {
  return sine({ sampleRate: RATE, seconds, freq: 1000, amplitude: dbToGain(db) });
}

async function integrated(name: string, channels: Float32Array[]): Promise<number | null> {
  const path = temp.path(name);
  await writeWav(path, channels, { sampleRate: RATE, encoding: 'float', bits: 32 });
  return (await analyzeStem(path)).integratedLufs;
}

describe('EBU Tech 3341 integrated loudness', () => {
  it('reads case 1 (stereo 1 kHz at −23 dBFS, 20 s) as −23.0 LUFS ±0.1 (EBU Tech 3341 case 1)', async () => {
    const s = tone(-23, 20);
    expect(await integrated('case1.wav', [s, s])).toBeCloseTo(-23, 1);
  });

  it('reads case 2 (stereo 1 kHz at −33 dBFS, 20 s) as −33.0 LUFS ±0.1 (EBU Tech 3341 case 2)', async () => {
    const s = tone(-33, 20);
    const value = await integrated('case2.wav', [s, s]);
    expect(Math.abs((value ?? 0) + 33)).toBeLessThanOrEqual(0.1);
  });

  it('reads the calibration signal (stereo 1 kHz at −18 dBFS) as −18.0 LUFS ±0.1 (EBU Tech 3341 calibration)', async () => {
    const s = tone(-18, 20);
    const value = await integrated('calibration.wav', [s, s]);
    expect(Math.abs((value ?? 0) + 18)).toBeLessThanOrEqual(0.1);
  });

  it('gates case 3 (−36 / −23 / −36 dBFS for 10 / 60 / 10 s) to −23.0 LUFS ±0.1 (EBU Tech 3341 case 3, from memory)', async () => {
    const s = concat(tone(-36, 10), tone(-23, 60), tone(-36, 10));
    const value = await integrated('case3.wav', [s, s]);
    expect(Math.abs((value ?? 0) + 23)).toBeLessThanOrEqual(0.1);
  });

  it('gates case 4 (−72 / −36 / −23 / −36 / −72 dBFS) to −23.0 LUFS ±0.1 (EBU Tech 3341 case 4, from memory)', async () => {
    const s = concat(tone(-72, 10), tone(-36, 10), tone(-23, 60), tone(-36, 10), tone(-72, 10));
    const value = await integrated('case4.wav', [s, s]);
    expect(Math.abs((value ?? 0) + 23)).toBeLessThanOrEqual(0.1);
  });

  it('reads case 5 (−26 / −20 / −26 dBFS for 20 / 20.1 / 20 s) as −23.0 LUFS ±0.1 (EBU Tech 3341 case 5, from memory)', async () => {
    const s = concat(tone(-26, 20), tone(-20, 20.1), tone(-26, 20));
    const value = await integrated('case5.wav', [s, s]);
    expect(Math.abs((value ?? 0) + 23)).toBeLessThanOrEqual(0.1);
  });

  it('weights surrounds by 1.41 in case 6 (5.0: L/R −28, C −24, Ls/Rs −30 dBFS) to −23.0 LUFS ±0.1 (EBU Tech 3341 case 6, from memory)', async () => {
    const lr = tone(-28, 20);
    const c = tone(-24, 20);
    const surround = tone(-30, 20);
    const value = await integrated('case6.wav', [lr, lr, c, surround, surround]);
    expect(Math.abs((value ?? 0) + 23)).toBeLessThanOrEqual(0.1);
  });

  it('gives no integrated loudness for a stem below the −70 LUFS absolute gate (BS.1770-4 gating)', async () => {
    const s = tone(-80, 5);
    expect(await integrated('below-gate.wav', [s, s])).toBeNull();
  });
});

describe('ITU-R BS.1770 check value', () => {
  it('reads a 0 dBFS 997 Hz sine on one front channel as −3.01 LKFS (ITU-R BS.1770-5 text)', async () => {
    const path = temp.path('997.wav');
    await writeWav(path, [sine({ sampleRate: RATE, seconds: 10, freq: 997, amplitude: 1 })], { sampleRate: RATE, encoding: 'float', bits: 32 });
    const value = (await analyzeStem(path)).integratedLufs ?? 0;
    expect(Math.abs(value + 3.01)).toBeLessThanOrEqual(0.01);
  });

  // The 48 kHz tables are themselves a bilinear transform of the prototypes, so other rates differ by
  // the transform's frequency warping: a few hundredths of a dB at 1 kHz.
  it('reads the same sine within 0.05 dB at 44.1 and 96 kHz with K-weighting re-derived per rate (ITU-R BS.1770-5 Annex 1)', async () => {
    for (const sampleRate of [44_100, 96_000]) {
      const path = temp.path(`997-${sampleRate}.wav`);
      await writeWav(path, [sine({ sampleRate, seconds: 5, freq: 997, amplitude: 1 })], { sampleRate, encoding: 'float', bits: 32 });
      const value = (await analyzeStem(path)).integratedLufs ?? 0;
      expect(Math.abs(value + 3.01)).toBeLessThanOrEqual(0.05);
    }
  });
});
