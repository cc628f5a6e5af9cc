// Where MPEG audio frames start, so the first seconds of a preview can be decoded on their own. Header
// layout and frame-length formula from ISO/IEC 11172-3 and 13818-3 (from memory): Layer III frames hold
// 1152 samples (MPEG-1) or 576 (MPEG-2/2.5); length = samples/8 × bitrate / rate + padding.

const BITRATES_V1_L3 = [0, 32, 40, 48, 56, 64, 80, 96, 112, 128, 160, 192, 224, 256, 320];
const BITRATES_V2_L3 = [0, 8, 16, 24, 32, 40, 48, 56, 64, 80, 96, 112, 128, 144, 160];
const RATES: Record<number, number[]> = { 3: [44100, 48000, 32000], 2: [22050, 24000, 16000], 0: [11025, 12000, 8000] };

export type FrameHeader = { length: number; samples: number; sampleRate: number };

export function readFrameHeader(bytes: Uint8Array, at: number): FrameHeader | null {
  if (at + 4 > bytes.length || bytes[at] !== 0xff || (bytes[at + 1] & 0xe0) !== 0xe0) return null;
  const version = (bytes[at + 1] >> 3) & 0x3; // 3 = MPEG-1, 2 = MPEG-2, 0 = MPEG-2.5
  const layer = (bytes[at + 1] >> 1) & 0x3; // 1 = Layer III
  if (version === 1 || layer !== 1) return null;
  const bitrateIndex = (bytes[at + 2] >> 4) & 0xf;
  const rateIndex = (bytes[at + 2] >> 2) & 0x3;
  if (bitrateIndex === 0 || bitrateIndex === 15 || rateIndex === 3) return null;
  const padding = (bytes[at + 2] >> 1) & 0x1;
  const kbps = (version === 3 ? BITRATES_V1_L3 : BITRATES_V2_L3)[bitrateIndex];
  const sampleRate = RATES[version][rateIndex];
  const samples = version === 3 ? 1152 : 576;
  return { length: Math.floor(((samples / 8) * kbps * 1000) / sampleRate) + padding, samples, sampleRate };
}

/** The byte length of the whole frames that cover the first `seconds` (the whole file when shorter). */
export function prefixBytes(bytes: Uint8Array, seconds: number): number {
  let at = 0;
  let covered = 0;
  while (at < bytes.length) {
    const frame = readFrameHeader(bytes, at);
    if (!frame) return bytes.length;
    at += frame.length;
    covered += frame.samples / frame.sampleRate;
    if (covered >= seconds) return Math.min(at, bytes.length);
  }
  return bytes.length;
}
