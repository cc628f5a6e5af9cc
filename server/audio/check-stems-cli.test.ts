import { execFile } from 'node:child_process';
import { writeFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderKit, sine, writeWav } from './testing/synth-wav';
import { makeTempDir } from './testing/temp-dir';

// The engineers' command (scripts/check-stems.ts), run as a real process: JSON shape and exit codes.
const SCRIPT = fileURLToPath(new URL('../../scripts/check-stems.ts', import.meta.url));
let temp: Awaited<ReturnType<typeof makeTempDir>>;
let kick: string;
let snare: string;

function cli(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, ['--import', 'tsx', SCRIPT, ...args], { maxBuffer: 16 * 1024 * 1024 }, (error, stdout, stderr) => {
      resolve({ code: error ? Number(error.code ?? 1) : 0, stdout, stderr });
    });
  });
}

beforeAll(async () => {
  temp = await makeTempDir();
  const kit = renderKit({ sampleRate: 48_000, seconds: 6, tempo: 120, seed: 8 });
  kick = temp.path('Kick In.wav');
  snare = temp.path('Kick Out.wav');
  await writeWav(kick, [kit[0].samples], { sampleRate: 48_000, bits: 24 });
  await writeWav(snare, [kit[1].samples], { sampleRate: 48_000, bits: 24 });
});
afterAll(async () => {
  await temp.cleanup();
});

const STEM_KEYS = ['file', 'format', 'sampleRate', 'bitDepth', 'channels', 'frames', 'durationSec', 'samplePeakDbfs', 'truePeakDbtp', 'integratedLufs', 'rmsDbfs', 'dcOffset', 'clippedRuns', 'silent', 'rumbleDb', 'timeReference'];

describe('npm run check-stems', () => {
  it('prints exactly the documented JSON shape and exits 0 when nothing fails', async () => {
    const { code, stdout } = await cli(['--json', '--rate', '48000', '--depth', '24', kick, snare]);
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    expect(Object.keys(json)).toEqual(['stems', 'pairs', 'checks']);
    expect(Object.keys(json.stems[0])).toEqual(STEM_KEYS);
    expect(json.stems[0]).toMatchObject({ file: kick, sampleRate: 48_000, bitDepth: 24, channels: 1, frames: 288_000, durationSec: 6, timeReference: null });
    expect(Object.keys(json.pairs[0])).toEqual(['a', 'b', 'lagSamples', 'lagMs', 'distanceCm', 'correlation', 'polarity']);
    expect(json.pairs[0]).toMatchObject({ a: kick, b: snare, polarity: 'same' });
    for (const check of json.checks) {
      expect(Object.keys(check).filter((k) => k !== 'detail')).toEqual(['id', 'level', 'message', 'files']);
    }
  });

  it('exits 1 when a check fails (wrong sample rate)', async () => {
    const { code, stdout } = await cli(['--json', '--rate', '44100', kick]);
    expect(code).toBe(1);
    expect(JSON.parse(stdout).checks.find((c: { id: string }) => c.id === 'sample-rate').level).toBe('fail');
  });

  it('exits 2 and names the reason when a file cannot be read', async () => {
    const text = temp.path('notes.wav');
    await writeFile(text, 'just some text');
    const { code, stdout } = await cli(['--json', kick, text]);
    expect(code).toBe(2);
    const failed = JSON.parse(stdout).checks.find((c: { level: string }) => c.level === 'fail');
    expect(failed.message).toContain('not a WAV file');
  });

  it('prints a readable table without --json', async () => {
    const clipped = temp.path('clipped.wav');
    await writeWav(clipped, [sine({ sampleRate: 48_000, seconds: 1, freq: 100, amplitude: 2 })], { sampleRate: 48_000, bits: 16 });
    const { code, stdout } = await cli([clipped]);
    expect(code).toBe(1);
    expect(stdout).toContain('peak dBFS');
    expect(stdout).toContain('[FAIL] 1 stem is clipped');
  });
});
