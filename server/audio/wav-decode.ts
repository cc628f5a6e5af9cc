// Decoders from interleaved WAV bytes to per-channel Float32 in [-1, 1). Tight loops without per-sample
// allocation; 24-bit by hand (3 bytes little-endian, signed, value / 2^23 — RIFF/EBU Tech 3285 layout).

export type SampleEncoding = 'pcm' | 'float';

export interface DecodeFormat {
  encoding: SampleEncoding;
  bitsPerSample: number;
  channels: number;
}

const INV_2_7 = 1 / 128;
const INV_2_15 = 1 / 32768;
const INV_2_23 = 1 / 8388608;
const INV_2_31 = 1 / 2147483648;

function decode24(bytes: Uint8Array, frames: number, channels: number, into: Float32Array[], offset: number): void {
  if (channels === 1) {
    const out = into[0];
    for (let i = 0, b = 0; i < frames; i++, b += 3) {
      // Put the 24 bits at the top of an int32 and shift back down to sign-extend.
      out[offset + i] = (((bytes[b] << 8) | (bytes[b + 1] << 16) | (bytes[b + 2] << 24)) >> 8) * INV_2_23;
    }
    return;
  }
  const stride = channels * 3;
  for (let c = 0; c < channels; c++) {
    const out = into[c];
    for (let i = 0, b = c * 3; i < frames; i++, b += stride) {
      out[offset + i] = (((bytes[b] << 8) | (bytes[b + 1] << 16) | (bytes[b + 2] << 24)) >> 8) * INV_2_23;
    }
  }
}

function decodeStrided(
  view: ArrayLike<number>,
  frames: number,
  channels: number,
  into: Float32Array[],
  offset: number,
  scale: number,
  bias: number,
): void {
  for (let c = 0; c < channels; c++) {
    const out = into[c];
    for (let i = 0, s = c; i < frames; i++, s += channels) out[offset + i] = (view[s] - bias) * scale;
  }
}

/** Decodes `frames` interleaved frames from `bytes` (which must start at an aligned ArrayBuffer offset). */
export function decodeFrames(bytes: Uint8Array, frames: number, format: DecodeFormat, into: Float32Array[], offset: number): void {
  const { channels, bitsPerSample, encoding } = format;
  const samples = frames * channels;
  const { buffer, byteOffset } = bytes;
  if (encoding === 'float') {
    const view = bitsPerSample === 32 ? new Float32Array(buffer, byteOffset, samples) : new Float64Array(buffer, byteOffset, samples);
    decodeStrided(view, frames, channels, into, offset, 1, 0);
    return;
  }
  switch (bitsPerSample) {
    case 8:
      // 8-bit WAV is unsigned with 128 as zero.
      decodeStrided(bytes, frames, channels, into, offset, INV_2_7, 128);
      return;
    case 16:
      decodeStrided(new Int16Array(buffer, byteOffset, samples), frames, channels, into, offset, INV_2_15, 0);
      return;
    case 24:
      decode24(bytes, frames, channels, into, offset);
      return;
    case 32:
      decodeStrided(new Int32Array(buffer, byteOffset, samples), frames, channels, into, offset, INV_2_31, 0);
      return;
    default:
      throw new Error(`no decoder for PCM ${bitsPerSample}-bit`);
  }
}
