import { afterAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { mp3Peaks, Mp3DecodeError } from './mp3-peaks';
import { PEAK_LEVELS } from './analyze-stem';

const dir = mkdtempSync(join(tmpdir(), 'kitlane-mp3-peaks-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Debian's ffmpeg encodes the test file, so the decoder is checked against an independent encoder. */
function encodeSine(name: string, seconds: number, volume: number): string {
  const path = join(dir, name);
  execFileSync('ffmpeg', ['-hide_banner', '-loglevel', 'error', '-f', 'lavfi', '-i', `sine=frequency=440:duration=${seconds}:sample_rate=44100`, '-af', `volume=${volume}`, '-c:a', 'libmp3lame', '-b:a', '192k', path]);
  return path;
}

describe('MP3 waveform peaks', () => {
  it('reads length, rate and level of an encoded sine', async () => {
    // ffmpeg's sine source has amplitude 1/8; volume=4 makes it 0.5 (MP3 coding moves peaks by a few per cent).
    const peaks = await mp3Peaks(encodeSine('half.mp3', 2, 4));
    expect(peaks.sampleRate).toBe(44100);
    // The encoder adds a frame of padding at most (1152 samples ≈ 26 ms), so length is checked to 0.1 s.
    expect(peaks.durationSec).toBeGreaterThan(1.95);
    expect(peaks.durationSec).toBeLessThan(2.1);
    const fine = peaks.levels[0];
    expect(fine.samplesPerPixel).toBe(PEAK_LEVELS[0]);
    const middle = fine.data.slice(Math.floor(fine.data.length * 0.25), Math.floor(fine.data.length * 0.75));
    expect(Math.max(...middle)).toBeCloseTo(0.5, 1);
    expect(Math.min(...middle)).toBeGreaterThan(0.4);
  });

  it('refuses a file with no MPEG audio in it', async () => {
    const path = join(dir, 'words.mp3');
    writeFileSync(path, 'these are words, not audio\n'.repeat(200));
    await expect(mp3Peaks(path)).rejects.toBeInstanceOf(Mp3DecodeError);
  });
});
