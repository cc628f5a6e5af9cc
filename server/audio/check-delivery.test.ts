import { writeFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkDelivery } from './check-delivery';
import { createCheckPool } from './pool';
import { renderKit, sine, writeWav } from './testing/synth-wav';
import { makeTempDir } from './testing/temp-dir';
import { deliveryCheckReportSchema } from '@shared/schemas/delivery-check';

const RATE = 48_000;
let temp: Awaited<ReturnType<typeof makeTempDir>>;
let kitFiles: { path: string; name: string }[];

beforeAll(async () => {
  temp = await makeTempDir();
  // 8 bars of 4/4 at 120 BPM = 16 s.
  const kit = renderKit({ sampleRate: RATE, seconds: 16, tempo: 120, seed: 21 }).slice(0, 4);
  kitFiles = [];
  for (const stem of kit) {
    const path = temp.path(stem.name);
    await writeWav(path, [stem.samples], { sampleRate: RATE, bits: 24, bext: { timeReference: 48_000 * 3600 } });
    kitFiles.push({ path, name: stem.name });
  }
});
afterAll(async () => {
  await temp.cleanup();
});

const byId = (report: Awaited<ReturnType<typeof checkDelivery>>, id: string) => report.checks.find((c) => c.id === id);

describe('checkDelivery', () => {
  it('passes a clean kick and snare delivery and tells the songwriter to flip the snare bottom', async () => {
    const report = await checkDelivery(kitFiles, { sampleRate: 48_000, bitDepth: 24, tempo: 120, bars: 8, beatsPerBar: 4 });
    expect(deliveryCheckReportSchema.parse(report)).toEqual(report);
    expect(report.checks.filter((c) => c.level === 'fail')).toEqual([]);
    expect(byId(report, 'same-start')?.level).toBe('pass');
    expect(byId(report, 'song-length')?.level).toBe('pass');
    const snare = report.pairs.find((p) => p.a === 'Snare Top.wav' && p.b === 'Snare Bottom.wav');
    expect(snare?.polarity).toBe('inverted');
    const snareItem = byId(report, 'pair:Snare Top.wav|Snare Bottom.wav');
    expect(snareItem?.level).toBe('warn');
    expect(snareItem?.message).toContain("flip snare bottom's polarity");
    const kick = report.pairs.find((p) => p.a === 'Kick In.wav' && p.b === 'Kick Out.wav');
    // renderKit puts kick out 0.9 ms (43 samples) behind kick in.
    expect(Math.abs((kick?.lagSamples ?? 0) - 43)).toBeLessThanOrEqual(1);
    expect(report.summary).toBe('4 stems, 48 kHz / 24-bit, all aligned; snare bottom inverted against snare top');
  });

  it('accepts the inverted snare bottom without a warning when the brief expects it inverted', async () => {
    const report = await checkDelivery(kitFiles, { pairs: [{ a: 'Snare Top.wav', b: 'Snare Bottom.wav', expectInverted: true }] });
    expect(byId(report, 'pair:Snare Top.wav|Snare Bottom.wav')?.level).toBe('pass');
  });

  it('fails wrong rates, unreadable files, clipping and different start points, and warns on length against the brief', async () => {
    const slow = temp.path('Tom 1.wav');
    await writeWav(slow, [sine({ sampleRate: 44_100, seconds: 2, freq: 100, amplitude: 0.5 })], { sampleRate: 44_100, bits: 24, bext: { timeReference: 44_100 * 3600 } });
    const clipped = temp.path('HH.wav');
    await writeWav(clipped, [sine({ sampleRate: RATE, seconds: 2, freq: 200, amplitude: 1.5 })], { sampleRate: RATE, bits: 16, bext: { timeReference: 0 } });
    const text = temp.path('Room L.wav');
    await writeFile(text, 'not audio at all');
    const report = await checkDelivery(
      [...kitFiles.slice(0, 1), { path: slow, name: 'Tom 1.wav' }, { path: clipped, name: 'HH.wav' }, { path: text, name: 'Room L.wav' }],
      { sampleRate: 48_000, bitDepth: 24, tempo: 120, bars: 16 },
    );
    expect(byId(report, 'readable:Room L.wav')).toMatchObject({ level: 'fail', files: ['Room L.wav'] });
    expect(report.unreadable).toEqual([{ file: text, name: 'Room L.wav', reason: 'not a WAV file (starts with "not ")' }]);
    expect(byId(report, 'sample-rate')).toMatchObject({ level: 'fail', files: ['Tom 1.wav'] });
    expect(byId(report, 'bit-depth')).toMatchObject({ level: 'fail', files: ['HH.wav'] });
    expect(byId(report, 'clipping')).toMatchObject({ level: 'fail', files: ['HH.wav'] });
    expect(byId(report, 'same-start')?.level).toBe('fail');
    expect(byId(report, 'same-length')?.level).toBe('warn');
    expect(byId(report, 'song-length')?.level).toBe('warn');
    expect(report.level).toBe('fail');
  });

  it('pairs stems without part names by their correlation and reports an inverted copy', async () => {
    const kit = renderKit({ sampleRate: RATE, seconds: 8, tempo: 100, seed: 2 });
    const source = kit[2].samples;
    const copy = new Float32Array(source.length);
    for (let i = 20; i < copy.length; i++) copy[i] = -0.8 * source[i - 20];
    const a = temp.path('take-a.wav');
    const b = temp.path('take-b.wav');
    const unrelated = temp.path('take-c.wav');
    await writeWav(a, [source], { sampleRate: RATE, bits: 24 });
    await writeWav(b, [copy], { sampleRate: RATE, bits: 24 });
    await writeWav(unrelated, [kit[4].samples.map((v, i) => (i % 7 === 0 ? v : -v))], { sampleRate: RATE, bits: 24 });
    const report = await checkDelivery([{ path: a, name: 'take-a.wav' }, { path: b, name: 'take-b.wav' }, { path: unrelated, name: 'take-c.wav' }], {});
    expect(report.pairs).toHaveLength(1);
    expect(report.pairs[0]).toMatchObject({ a: 'take-a.wav', b: 'take-b.wav', kind: 'correlated', lagSamples: 20, polarity: 'inverted' });
    expect(byId(report, 'pair:take-a.wav|take-b.wav')?.level).toBe('warn');
  });

  it('gives the same report through the worker pool, with progress up to 1', async () => {
    const pool = createCheckPool({ maxThreads: 2 });
    const progress: number[] = [];
    try {
      const pooled = await checkDelivery(kitFiles, { sampleRate: 48_000 }, { pool, onProgress: (f) => progress.push(f) });
      const local = await checkDelivery(kitFiles, { sampleRate: 48_000 });
      expect(pooled).toEqual(local);
    } finally {
      await pool.destroy();
    }
    expect(progress.at(-1)).toBe(1);
    expect(progress).toEqual([...progress].sort((x, y) => x - y));
  });

  it('writes waveform peaks at two zoom levels when given a peaks folder', async () => {
    const report = await checkDelivery(kitFiles.slice(0, 1), {}, { peaksDir: temp.dir });
    const peaksFile = report.stems[0].peaksFile;
    expect(peaksFile).not.toBeNull();
    const { readFile } = await import('node:fs/promises');
    const peaks = JSON.parse(await readFile(peaksFile ?? '', 'utf8'));
    expect(peaks.levels.map((l: { samplesPerPixel: number }) => l.samplesPerPixel)).toEqual([256, 4096]);
    expect(peaks.levels[0].data).toHaveLength(Math.ceil((16 * RATE) / 256));
    expect(Math.max(...peaks.levels[1].data)).toBeCloseTo(10 ** ((report.stems[0].samplePeakDbfs ?? 0) / 20), 2);
  });
});
