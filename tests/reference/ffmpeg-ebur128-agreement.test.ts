import { execFile } from 'node:child_process';
import { existsSync } from 'node:fs';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeStem } from '../../server/audio/analyze-stem';
import { renderKit, writeWav } from '../../server/audio/testing/synth-wav';
import { makeTempDir } from '../../server/audio/testing/temp-dir';

// Independent reference: Debian's ffmpeg ebur128 filter (REFERENCES.md). Its true peak comes from a
// different oversampler, so the tolerance there is 0.5 dB; integrated loudness must agree within 0.1 LU.
const FFMPEG = '/usr/bin/ffmpeg';
const run = promisify(execFile);
const hasFfmpeg = existsSync(FFMPEG);
let temp: Awaited<ReturnType<typeof makeTempDir>>;

async function ffmpegMeasure(path: string): Promise<{ integrated: number; truePeakDb: number }> {
  // The metadata print gives three decimals (the summary only one); the last frame carries the whole file.
  const { stdout } = await run(FFMPEG, ['-nostats', '-hide_banner', '-i', path, '-af', 'ebur128=metadata=1:peak=true,ametadata=mode=print:file=-', '-f', 'null', '-'], { maxBuffer: 64 * 1024 * 1024 });
  const integrated = [...stdout.matchAll(/lavfi\.r128\.I=(-?[\d.]+)/g)].at(-1)?.[1];
  const peaks = [...stdout.matchAll(/lavfi\.r128\.true_peaks_ch(\d+)=([\d.]+)/g)];
  const peak = Math.max(...peaks.slice(-4).map((m) => Number(m[2])));
  if (integrated === undefined || peaks.length === 0) throw new Error(`could not parse ffmpeg output for ${path}`);
  return { integrated: Number(integrated), truePeakDb: 20 * Math.log10(peak) };
}

beforeAll(async () => {
  temp = await makeTempDir();
});
afterAll(async () => {
  await temp.cleanup();
});

describe.skipIf(!hasFfmpeg)('agreement with ffmpeg ebur128 (Debian ffmpeg, REFERENCES.md)', () => {
  const kit = renderKit({ sampleRate: 48_000, seconds: 12, tempo: 112, seed: 5 });
  for (const stem of [kit[0], kit[2], kit[3], kit[4], kit[8]]) {
    it(`agrees on ${stem.name} within 0.1 LU integrated and 0.5 dB true peak (ffmpeg ebur128 filter)`, async () => {
      const path = temp.path(stem.name);
      await writeWav(path, [stem.samples], { sampleRate: 48_000, bits: 24 });
      const ours = await analyzeStem(path);
      const theirs = await ffmpegMeasure(path);
      expect(Math.abs((ours.integratedLufs ?? 0) - theirs.integrated)).toBeLessThanOrEqual(0.1);
      expect(Math.abs((ours.truePeakDbtp ?? 0) - theirs.truePeakDb)).toBeLessThanOrEqual(0.5);
    });
  }

  it('agrees on a stereo 44.1 kHz 16-bit drum mix within 0.1 LU and 0.5 dB (ffmpeg ebur128 filter)', async () => {
    const kit44 = renderKit({ sampleRate: 44_100, seconds: 10, tempo: 96, seed: 9 });
    const left = kit44[8].samples;
    const right = kit44[9].samples;
    const path = temp.path('mix-44k.wav');
    await writeWav(path, [left, right], { sampleRate: 44_100, bits: 16 });
    const ours = await analyzeStem(path);
    const theirs = await ffmpegMeasure(path);
    expect(Math.abs((ours.integratedLufs ?? 0) - theirs.integrated)).toBeLessThanOrEqual(0.1);
    expect(Math.abs((ours.truePeakDbtp ?? 0) - theirs.truePeakDb)).toBeLessThanOrEqual(0.5);
  });
});

if (!hasFfmpeg) {
  describe('agreement with ffmpeg ebur128', () => {
    it.skip(`skipped: ${FFMPEG} is missing (install Debian's ffmpeg package to run it)`, () => undefined);
  });
}
