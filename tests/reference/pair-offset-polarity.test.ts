import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { measureStem } from '../../server/audio/analyze-stem';
import { filterInPlace, lowPass, highPass } from '../../server/audio/filters';
import { measurePair } from '../../server/audio/pairs';
import { drumTemplates, renderMic, rockPattern, writeWav } from '../../server/audio/testing/synth-wav';
import { makeTempDir } from '../../server/audio/testing/temp-dir';
import { WavReader } from '../../server/audio/wav-reader';

// A pair made by filtering, delaying and inverting one signal must be found with the right lag (±1
// sample) and polarity. Distance per ms at 343 m/s (REFERENCES.md: 1 ms ≈ 34.3 cm).
const RATE = 48_000;
let temp: Awaited<ReturnType<typeof makeTempDir>>;

beforeAll(async () => {
  temp = await makeTempDir();
});
afterAll(async () => {
  await temp.cleanup();
});

function snareSource(seconds: number): Float32Array {
  const events = rockPattern({ sampleRate: RATE, seconds, tempo: 100, seed: 3 }).filter((e) => e.voice === 'snare' || e.voice === 'kick');
  return renderMic({ sampleRate: RATE, frames: seconds * RATE, events, pickups: [{ voice: 'snare', gain: 0.7, delaySamples: 0 }, { voice: 'kick', gain: 0.5, delaySamples: 0 }], seed: 4, templates: drumTemplates(RATE, 11) });
}

// Forward and backward through the same filter: a zero-phase colouring, so the only delay in the pair
// is the one the test puts in (a one-way IIR would add its own group delay, ~4 samples at 3 kHz).
function zeroPhase(x: Float32Array, sections: Parameters<typeof filterInPlace>[1]): void {
  filterInPlace(x, sections);
  x.reverse();
  filterInPlace(x, sections);
  x.reverse();
}

function delayed(x: Float32Array, samples: number, sign: 1 | -1): Float32Array {
  const out = new Float32Array(x.length);
  for (let i = samples; i < x.length; i++) out[i] = sign * x[i - samples];
  return out;
}

async function measure(a: Float32Array, b: Float32Array, tag: string) {
  const pa = temp.path(`${tag}-a.wav`);
  const pb = temp.path(`${tag}-b.wav`);
  await writeWav(pa, [a], { sampleRate: RATE, encoding: 'float', bits: 32 });
  await writeWav(pb, [b], { sampleRate: RATE, encoding: 'float', bits: 32 });
  const [sa, sb] = await Promise.all([measureStem(pa), measureStem(pb)]);
  const [ra, rb] = await Promise.all([WavReader.open(pa), WavReader.open(pb)]);
  try {
    return await measurePair({ reader: ra, activity: sa.activity }, { reader: rb, activity: sb.activity });
  } finally {
    await Promise.all([ra.close(), rb.close()]);
  }
}

describe('pair offset and polarity from band-limited cross-correlation', () => {
  it('finds a low-passed copy delayed by 37 samples and inverted: lag 37 ±1, inverted (delay and polarity built in)', async () => {
    const a = snareSource(8);
    const b = delayed(a, 37, -1);
    zeroPhase(b, [lowPass(RATE, 3000, 0.707)]);
    const m = await measure(a, b, 'lp');
    expect(m).not.toBeNull();
    expect(Math.abs((m?.lagSamples ?? 0) - 37)).toBeLessThanOrEqual(1);
    expect(m?.polarity).toBe('inverted');
    expect(m?.distanceCm).toBeCloseTo((37 / RATE) * 34_300, -1);
  });

  it('finds a high-passed copy arriving 2 ms earlier, same polarity: lag −96 ±1', async () => {
    const b = snareSource(8);
    const a = delayed(b, 96, 1);
    zeroPhase(a, [highPass(RATE, 200, 0.707)]);
    const m = await measure(a, b, 'hp');
    expect(Math.abs((m?.lagSamples ?? 0) + 96)).toBeLessThanOrEqual(1);
    expect(m?.polarity).toBe('same');
    expect(m?.correlation).toBeGreaterThan(0.5);
  });

  it('reports no measurement when the two stems never play at the same time', async () => {
    const a = snareSource(6);
    const b = new Float32Array(a.length);
    const m = await measure(a, b, 'silent');
    expect(m).toBeNull();
  });
});
