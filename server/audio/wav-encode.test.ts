import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { encodeWav16Mono } from './wav-encode';

const dir = mkdtempSync(join(tmpdir(), 'kitlane-wav-encode-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('the 16-bit mono WAV encoder', () => {
  it('writes the canonical header and clamps full scale to the two ends of the 16-bit range', () => {
    const wav = encodeWav16Mono(new Float32Array([0, 1, -1, 2, -2]), 22050);
    expect(wav.toString('latin1', 0, 4)).toBe('RIFF');
    expect(wav.readUInt32LE(4)).toBe(wav.length - 8);
    expect(wav.readUInt32LE(24)).toBe(22050);
    expect(wav.readUInt32LE(28)).toBe(22050 * 2);
    expect(wav.readUInt16LE(34)).toBe(16);
    expect(wav.readUInt32LE(40)).toBe(10);
    expect([0, 1, 2, 3, 4].map((i) => wav.readInt16LE(44 + i * 2))).toEqual([0, 32767, -32768, 32767, -32768]);
  });

  it('is read back sample for sample by ffmpeg (an outside reader of the format)', () => {
    const samples = Float32Array.from({ length: 1000 }, (_, i) => Math.sin(i / 7) * 0.8);
    const path = join(dir, 'sine.wav');
    writeFileSync(path, encodeWav16Mono(samples, 48000));
    const probe = execFileSync('ffprobe', ['-v', 'error', '-show_entries', 'stream=codec_name,sample_rate,channels', '-of', 'csv=p=0', path]).toString().trim();
    expect(probe).toBe('pcm_s16le,48000,1');
    const raw = execFileSync('ffmpeg', ['-v', 'error', '-i', path, '-f', 's16le', '-']);
    const decoded = Array.from({ length: raw.length / 2 }, (_, i) => raw.readInt16LE(i * 2));
    expect(decoded).toEqual(Array.from(samples, (v) => Math.round(v < 0 ? v * 0x8000 : v * 0x7fff)));
  });
});
