import { writeFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeStem } from '../../server/audio/analyze-stem';
import { buildWav, sine } from '../../server/audio/testing/synth-wav';
import { makeTempDir } from '../../server/audio/testing/temp-dir';
import { WavReader } from '../../server/audio/wav-reader';
import { WavError } from '../../server/audio/wav-errors';

// WAV layouts from the Microsoft RIFF docs, EBU Tech 3285 (BWF, bext), EBU Tech 3306 / ITU-R BS.2088
// (RF64/BW64) as summarised in REFERENCES.md, each with the result the reader must give.
const RATE = 48_000;
let temp: Awaited<ReturnType<typeof makeTempDir>>;
const tone = () => sine({ sampleRate: RATE, seconds: 0.5, freq: 440, amplitude: 0.5 });

beforeAll(async () => {
  temp = await makeTempDir();
});
afterAll(async () => {
  await temp.cleanup();
});

async function save(name: string, bytes: Buffer): Promise<string> {
  const path = temp.path(name);
  await writeFile(path, bytes);
  return path;
}

async function readAll(path: string): Promise<Float32Array> {
  const reader = await WavReader.open(path, { blockFrames: 1000 });
  const out = new Float32Array(reader.info.frames);
  const block = [new Float32Array(1000)];
  let at = 0;
  for (let n = await reader.read(block); n > 0; n = await reader.read(block)) {
    out.set(block[0].subarray(0, n), at);
    at += n;
  }
  await reader.close();
  return out;
}

async function failure(path: string): Promise<WavError> {
  const error = await WavReader.open(path).then(
    () => null,
    (e: unknown) => e,
  );
  if (!(error instanceof WavError)) throw new Error(`expected a WavError, got ${String(error)}`);
  return error;
}

describe('WAV edge cases (RIFF, EBU Tech 3285, EBU Tech 3306)', () => {
  it('skips an odd-sized chunk and its pad byte before the audio (Microsoft RIFF; EBU Tech 3285 Appendix A)', async () => {
    const x = tone();
    const path = await save('odd.wav', buildWav([x], { sampleRate: RATE, bits: 24, chunksBefore: [{ id: 'junk', body: Buffer.alloc(13, 7) }, { id: 'LIST', body: Buffer.from('odd') }] }));
    const samples = await readAll(path);
    expect(samples.length).toBe(x.length);
    expect(samples[100]).toBeCloseTo(x[100], 6);
  });

  it('also reads a file whose writer left out the pad byte after an odd chunk (tolerated writer bug)', async () => {
    const x = tone();
    const path = await save('unpadded.wav', buildWav([x], { sampleRate: RATE, bits: 16, chunksBefore: [{ id: 'junk', body: Buffer.alloc(13, 1) }], omitPadding: true }));
    const samples = await readAll(path);
    expect(samples.length).toBe(x.length);
    expect(samples[200]).toBeCloseTo(x[200], 4);
  });

  it('reads 24-bit mono WAVE_FORMAT_EXTENSIBLE with a fact chunk, where audio does not start at byte 44 (REFERENCES.md fmt layout)', async () => {
    const x = tone();
    const path = await save('ext.wav', buildWav([x], { sampleRate: RATE, bits: 24, extensible: true, fact: true }));
    const reader = await WavReader.open(path);
    expect(reader.info.extensible).toBe(true);
    expect(reader.info.channelMask).toBe(0x4);
    expect(reader.info.factSampleLength).toBe(x.length);
    expect(reader.info.dataOffset).toBeGreaterThan(44);
    await reader.close();
    const report = await analyzeStem(path);
    expect(report.bitDepth).toBe(24);
    expect(report.samplePeakDbfs).toBeCloseTo(-6.02, 1);
  });

  it('reads 20 valid bits in a 24-bit EXTENSIBLE container as 20-bit (wValidBitsPerSample)', async () => {
    const path = await save('ext20.wav', buildWav([tone()], { sampleRate: RATE, bits: 24, validBits: 20, extensible: true }));
    expect((await analyzeStem(path)).bitDepth).toBe(20);
  });

  it('reads IEEE float 32 and 64 with their values unchanged (format tag 3)', async () => {
    const x = tone();
    for (const bits of [32, 64]) {
      const path = await save(`float${bits}.wav`, buildWav([x], { sampleRate: RATE, encoding: 'float', bits, fact: true }));
      const samples = await readAll(path);
      expect(samples[123]).toBe(x[123]);
    }
  });

  it('reads PCM 8, 16 and 32-bit with the right scale (RIFF PCM)', async () => {
    const x = tone();
    for (const bits of [8, 16, 32]) {
      const path = await save(`pcm${bits}.wav`, buildWav([x], { sampleRate: RATE, bits }));
      const report = await analyzeStem(path);
      expect(Math.abs((report.samplePeakDbfs ?? 0) + 6.02)).toBeLessThan(bits === 8 ? 0.1 : 0.01);
    }
  });

  it('reads an RF64 file forced on a small stem, taking the data size from ds64 (EBU Tech 3306)', async () => {
    const x = tone();
    const path = await save('rf64.wav', buildWav([x, x], { sampleRate: RATE, bits: 24, rf64: 'RF64' }));
    const reader = await WavReader.open(path);
    expect(reader.info.container).toBe('RF64');
    expect(reader.info.frames).toBe(x.length);
    await reader.close();
    expect((await analyzeStem(path)).format).toBe('RF64 PCM');
  });

  it('reads a BW64 header the same way (ITU-R BS.2088)', async () => {
    const path = await save('bw64.wav', buildWav([tone()], { sampleRate: RATE, encoding: 'float', bits: 32, rf64: 'BW64' }));
    expect((await analyzeStem(path)).container).toBe('BW64');
  });

  it('reads the bext TimeReference from bytes 338/342, beyond 32 bits (EBU Tech 3285)', async () => {
    // 23:59:59 at 192 kHz needs more than 32 bits: 86399 × 192000 = 16 588 608 000 samples.
    const timeReference = 86_399 * 192_000;
    const path = await save('bext.wav', buildWav([tone()], { sampleRate: RATE, bits: 24, bext: { timeReference } }));
    const report = await analyzeStem(path);
    expect(report.timeReference).toBe(timeReference);
    expect(report.format).toContain('bext');
  });

  it('says "truncated" with both sizes when the data chunk claims more than the file has', async () => {
    const whole = buildWav([tone()], { sampleRate: RATE, bits: 24 });
    const path = await save('truncated.wav', whole.subarray(0, whole.length - 1000));
    const error = await failure(path);
    expect(error.code).toBe('truncated');
    expect(error.message).toBe(`truncated: data chunk claims ${whole.length - 44} bytes, file has ${whole.length - 44 - 1000}`);
  });

  it('says "not a WAV file" for a text file named .wav', async () => {
    const path = await save('notes.wav', Buffer.from('hello, these are my session notes\n'));
    const error = await failure(path);
    expect(error.code).toBe('not-wav');
    expect(error.message).toBe('not a WAV file (starts with "hell")');
  });

  it('names the format tag of an encoding it does not decode (MPEG layer 3, 0x0055)', async () => {
    const bytes = buildWav([tone()], { sampleRate: RATE, bits: 16 });
    bytes.writeUInt16LE(0x0055, 20);
    const error = await failure(await save('mp3.wav', bytes));
    expect(error.code).toBe('unsupported');
    expect(error.message).toBe('unsupported encoding (format tag 0x0055)');
  });
});
