import { createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { createMp3Encoder } from 'wasm-media-encoders';
import { WavReader } from '../../../audio/wav-reader';

// The review room plays compressed previews, never the originals: a 4-minute 24-bit stem is ~35 MB of WAV
// but ~1.9 MB as a 64 kbit/s MP3. Every stem of a delivery is encoded with the same settings, so the
// encoder's fixed start delay is the same for all of them and they stay sample-aligned with each other.

/** One rate for every preview, equal to the review room's AudioContext rate, so the browser never resamples. */
export const PREVIEW_SAMPLE_RATE = 24_000;
const KBPS_PER_CHANNEL = 64;

export type PreviewTask = { source: string; target: string };
export type PreviewResult = { bytes: number; channels: number; durationSec: number };

/** Keeps mono and stereo as they are; wider files are previewed as their first two channels. */
function previewChannels(channels: number): 1 | 2 {
  return channels >= 2 ? 2 : 1;
}

export async function encodePreview(task: PreviewTask): Promise<PreviewResult> {
  const reader = await WavReader.open(task.source);
  const out = createWriteStream(task.target);
  let bytes = 0;
  const write = async (chunk: Uint8Array) => {
    if (chunk.length === 0) return;
    bytes += chunk.length;
    // The encoder owns its output buffer: copy before the next call reuses it.
    if (!out.write(Buffer.from(chunk))) await once(out, 'drain');
  };
  try {
    const { info } = reader;
    const channels = previewChannels(info.channels);
    const encoder = await createMp3Encoder();
    encoder.configure({ sampleRate: info.sampleRate, channels, bitrate: channels === 2 ? 128 : KBPS_PER_CHANNEL, outputSampleRate: PREVIEW_SAMPLE_RATE });
    const block = Array.from({ length: info.channels }, () => new Float32Array(reader.framesPerBlock));
    for (;;) {
      const frames = await reader.read(block);
      if (frames === 0) break;
      // Full-scale float input may overshoot ±1 by a hair after decoding; the encoder wants [-1, 1].
      const input = block.slice(0, channels).map((c) => clampInPlace(c.subarray(0, frames)));
      await write(encoder.encode(input));
    }
    await write(encoder.finalize());
    out.end();
    await once(out, 'finish');
    return { bytes, channels, durationSec: info.frames / info.sampleRate };
  } catch (error) {
    out.destroy();
    throw error;
  } finally {
    await reader.close();
  }
}

function clampInPlace(samples: Float32Array): Float32Array {
  for (let i = 0; i < samples.length; i++) {
    const v = samples[i];
    if (v > 1) samples[i] = 1;
    else if (v < -1) samples[i] = -1;
  }
  return samples;
}
