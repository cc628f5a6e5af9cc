import { createReadStream } from 'node:fs';
import { MPEGDecoder } from 'mpg123-decoder';
import { buildPeaks, PEAK_LEVELS } from './analyze-stem';
import type { WaveformPeaks } from '@shared/schemas/delivery-check';

export class Mp3DecodeError extends Error {}

/**
 * Waveform peaks for an MP3, in the same shape analyzeStem writes for WAV files. The file is fed to the
 * decoder in chunks as it is read, so only one chunk of compressed and decoded audio is held at a time.
 */
export async function mp3Peaks(path: string): Promise<WaveformPeaks> {
  const decoder = new MPEGDecoder();
  await decoder.ready;
  const bucket = PEAK_LEVELS[0];
  const activity: number[] = [];
  let frames = 0;
  let sampleRate = 0;
  let current = 0;
  let inBucket = 0;
  try {
    for await (const chunk of createReadStream(path, { highWaterMark: 64 * 1024 })) {
      const decoded = decoder.decode(new Uint8Array(chunk as Buffer));
      if (decoded.samplesDecoded === 0) continue;
      sampleRate ||= decoded.sampleRate;
      const channels = decoded.channelData;
      for (let i = 0; i < decoded.samplesDecoded; i++) {
        for (const ch of channels) {
          const v = Math.abs(ch[i]);
          if (v > current) current = v;
        }
        if (++inBucket === bucket) {
          activity.push(current);
          current = 0;
          inBucket = 0;
        }
      }
      frames += decoded.samplesDecoded;
    }
  } finally {
    decoder.free();
  }
  if (inBucket > 0) activity.push(current);
  if (frames === 0 || sampleRate === 0) throw new Mp3DecodeError('No audio could be decoded from that MP3 file');
  return buildPeaks(Float32Array.from(activity), frames, sampleRate);
}
