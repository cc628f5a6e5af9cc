import { describe, expect, it } from 'vitest';
import { prefixBytes, readFrameHeader } from './mp3-frames';

// A frame header for MPEG-2 Layer III, 64 kbit/s, 24 kHz, no padding: FF F3 84 00 → 576 samples,
// 72 × 64000 / 24000 = 192 bytes (ISO/IEC 13818-3 frame length, from memory).
function cbrStream(frames: number): Uint8Array {
  const bytes = new Uint8Array(frames * 192);
  for (let i = 0; i < frames; i++) bytes.set([0xff, 0xf3, 0x84, 0x00], i * 192);
  return bytes;
}

describe('mp3 frame walking', () => {
  it('reads an MPEG-2 Layer III header as 576 samples in 192 bytes at 64 kbit/s and 24 kHz', () => {
    expect(readFrameHeader(cbrStream(1), 0)).toEqual({ length: 192, samples: 576, sampleRate: 24000 });
  });

  it('cuts after the whole frames that cover the asked seconds', () => {
    // 1 s at 24 kHz needs ceil(24000 / 576) = 42 frames.
    expect(prefixBytes(cbrStream(100), 1)).toBe(42 * 192);
  });

  it('gives the whole stream when it is shorter, or when a header does not parse', () => {
    expect(prefixBytes(cbrStream(10), 5)).toBe(10 * 192);
    const broken = cbrStream(10);
    broken[192 * 3] = 0;
    expect(prefixBytes(broken, 5)).toBe(broken.length);
  });
});
