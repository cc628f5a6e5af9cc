import { writeFile } from 'node:fs/promises';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeStem } from '../../server/audio/analyze-stem';
import { buildWav, sine } from '../../server/audio/testing/synth-wav';
import { makeTempDir } from '../../server/audio/testing/temp-dir';
import { WavError } from '../../server/audio/wav-errors';

// Property: whatever the bytes, reading ends within bounded time with either a report or a WavError
// carrying a reason, never another exception and never a hang (lying chunk sizes included).
const RATE = 8_000;
const BOUND_MS = 2_000;
let temp: Awaited<ReturnType<typeof makeTempDir>>;
let counter = 0;

beforeAll(async () => {
  temp = await makeTempDir();
});
afterAll(async () => {
  await temp.cleanup();
});

const tone = sine({ sampleRate: RATE, seconds: 0.05, freq: 440, amplitude: 0.5 });
const seeds: Buffer[] = [
  buildWav([tone], { sampleRate: RATE, bits: 16 }),
  buildWav([tone, tone], { sampleRate: RATE, bits: 24, extensible: true, fact: true, bext: { timeReference: 1234 } }),
  buildWav([tone], { sampleRate: RATE, encoding: 'float', bits: 32, rf64: 'RF64', chunksBefore: [{ id: 'junk', body: Buffer.alloc(7) }] }),
];

async function outcome(bytes: Uint8Array): Promise<'report' | 'wav-error'> {
  const path = temp.path(`fuzz-${counter++}.wav`);
  await writeFile(path, bytes);
  const started = performance.now();
  try {
    const report = await analyzeStem(path);
    expect(report.frames).toBeGreaterThanOrEqual(0);
    return 'report';
  } catch (error) {
    if (!(error instanceof WavError)) throw error;
    expect(error.message.length).toBeGreaterThan(5);
    return 'wav-error';
  } finally {
    expect(performance.now() - started).toBeLessThan(BOUND_MS);
  }
}

const seedArb = fc.integer({ min: 0, max: seeds.length - 1 }).map((i) => Buffer.from(seeds[i]));

describe('WAV reader under fuzzing (fast-check)', () => {
  it('answers every truncation of a valid file with a report or a clear error', async () => {
    await fc.assert(fc.asyncProperty(seedArb, fc.double({ min: 0, max: 1, noNaN: true }), async (seed, cut) => {
      await outcome(seed.subarray(0, Math.floor(seed.length * cut)));
    }), { numRuns: 120 });
  });

  it('answers lying chunk sizes (random, 0 and 0xFFFFFFFF) with a report or a clear error', async () => {
    const sizeArb = fc.oneof(fc.constant(0xffffffff), fc.constant(0), fc.integer({ min: 0, max: 0xffffffff }));
    await fc.assert(fc.asyncProperty(seedArb, fc.array(fc.tuple(fc.nat(), sizeArb), { minLength: 1, maxLength: 4 }), async (seed, edits) => {
      // Chunk size fields sit at 4 and after every 4-byte id; write over a few plausible ones.
      for (const [where, size] of edits) {
        const at = 4 + ((where % Math.max(1, Math.floor((seed.length - 8) / 4))) * 4);
        if (at + 4 <= seed.length) seed.writeUInt32LE(size, at);
      }
      await outcome(seed);
    }), { numRuns: 150 });
  });

  it('answers random byte mutations and plain random bytes with a report or a clear error', async () => {
    const mutated = fc.tuple(seedArb, fc.array(fc.tuple(fc.nat(), fc.integer({ min: 0, max: 255 })), { minLength: 1, maxLength: 16 })).map(([seed, edits]) => {
      for (const [where, value] of edits) seed[where % seed.length] = value;
      return new Uint8Array(seed);
    });
    const random = fc.uint8Array({ minLength: 0, maxLength: 600 });
    const riffPrefixed = fc.uint8Array({ minLength: 0, maxLength: 400 }).map((tail) => new Uint8Array([...Buffer.from('RIFF\xff\xff\xff\xffWAVE', 'latin1'), ...tail]));
    await fc.assert(fc.asyncProperty(fc.oneof(mutated, random, riffPrefixed), async (bytes) => {
      await outcome(bytes);
    }), { numRuns: 250 });
  });
});
