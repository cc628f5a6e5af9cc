import { writeFile } from 'node:fs/promises';

// Writers for test WAV files of every kind the reader must handle, and drum-like signals synthesised
// here (our own audio: decaying noise bursts and pitched thumps on a tempo grid).

export interface WavWriteOptions {
  sampleRate: number;
  encoding?: 'pcm' | 'float';
  /** Container width: 8/16/24/32 for PCM, 32/64 for float. */
  bits?: number;
  /** Write WAVE_FORMAT_EXTENSIBLE (cbSize 22) instead of a plain fmt chunk. */
  extensible?: boolean;
  validBits?: number;
  channelMask?: number;
  /** Add a fact chunk (sample length), as common tools do for EXTENSIBLE and float. */
  fact?: boolean;
  /** Write an RF64 or BW64 header with a ds64 chunk even though the file is small. */
  rf64?: 'RF64' | 'BW64';
  bext?: { timeReference: number; description?: string };
  /** Extra chunks before the data chunk (odd sizes get their pad byte). */
  chunksBefore?: { id: string; body: Buffer }[];
  chunksAfter?: { id: string; body: Buffer }[];
  /** Omit the pad byte after odd-sized chunks (a common writer bug the reader tolerates). */
  omitPadding?: boolean;
  /** Put this in the data chunk's size field instead of the real size (for lying-size tests). */
  dataSizeField?: number;
}

const GUID_TAIL = [0x00, 0x00, 0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71];

function chunk(id: string, body: Buffer, omitPadding = false, sizeField?: number): Buffer {
  const header = Buffer.alloc(8);
  header.write(id, 0, 4, 'latin1');
  header.writeUInt32LE(sizeField ?? body.length, 4);
  const pad = body.length % 2 === 1 && !omitPadding ? Buffer.alloc(1) : Buffer.alloc(0);
  return Buffer.concat([header, body, pad]);
}

function fmtBody(o: Required<Pick<WavWriteOptions, 'sampleRate' | 'encoding' | 'bits'>> & WavWriteOptions, channels: number): Buffer {
  const tag = o.encoding === 'pcm' ? 1 : 3;
  const blockAlign = channels * (o.bits / 8);
  const body = Buffer.alloc(o.extensible ? 40 : o.encoding === 'float' ? 18 : 16);
  body.writeUInt16LE(o.extensible ? 0xfffe : tag, 0);
  body.writeUInt16LE(channels, 2);
  body.writeUInt32LE(o.sampleRate, 4);
  body.writeUInt32LE(o.sampleRate * blockAlign, 8);
  body.writeUInt16LE(blockAlign, 12);
  body.writeUInt16LE(o.bits, 14);
  if (o.extensible) {
    body.writeUInt16LE(22, 16);
    body.writeUInt16LE(o.validBits ?? o.bits, 18);
    body.writeUInt32LE(o.channelMask ?? (channels === 1 ? 0x4 : channels === 2 ? 0x3 : 0), 20);
    body.writeUInt16LE(tag, 24);
    Buffer.from(GUID_TAIL).copy(body, 26);
  } else if (body.length === 18) {
    body.writeUInt16LE(0, 16);
  }
  return body;
}

export function bextBody(timeReference: number, description = 'Kitlane test stem'): Buffer {
  // 602 bytes: the fixed part of a version-1 bext chunk (EBU Tech 3285), no coding history.
  const body = Buffer.alloc(602);
  body.write(description, 0, 256, 'latin1');
  body.write('Kitlane', 256, 32, 'latin1');
  body.write('2024-01-01', 320, 10, 'latin1');
  body.write('00:00:00', 330, 8, 'latin1');
  body.writeUInt32LE(timeReference % 0x1_0000_0000, 338);
  body.writeUInt32LE(Math.floor(timeReference / 0x1_0000_0000), 342);
  body.writeUInt16LE(1, 346);
  return body;
}

/** Interleaves and quantises per-channel float samples (rounded, clamped to the code range). */
export function encodeSamples(channels: Float32Array[], encoding: 'pcm' | 'float', bits: number, validBits = bits): Buffer {
  const frames = channels[0]?.length ?? 0;
  const n = channels.length;
  const bytes = bits / 8;
  const out = Buffer.alloc(frames * n * bytes);
  if (encoding === 'float' && bits === 32) {
    // Fast path: interleave into a Float32Array over the output bytes (little-endian platform).
    const view = new Float32Array(out.buffer, out.byteOffset, frames * n);
    for (let c = 0; c < n; c++) for (let i = 0; i < frames; i++) view[i * n + c] = channels[c][i];
    return out;
  }
  const scale = 2 ** (validBits - 1);
  const shift = 2 ** (bits - validBits);
  for (let i = 0; i < frames; i++) {
    for (let c = 0; c < n; c++) {
      const v = channels[c][i];
      const at = (i * n + c) * bytes;
      if (encoding === 'float') {
        if (bits === 32) out.writeFloatLE(v, at);
        else out.writeDoubleLE(v, at);
        continue;
      }
      const code = Math.max(-scale, Math.min(scale - 1, Math.round(v * scale))) * shift;
      if (bits === 24) {
        // By hand: the generic Buffer writer is slow for the bench's 138 M samples.
        out[at] = code & 0xff;
        out[at + 1] = (code >> 8) & 0xff;
        out[at + 2] = (code >> 16) & 0xff;
      } else if (bits === 8) out[at] = code / shift + 128;
      else if (bits === 16) out.writeInt16LE(code, at);
      else out.writeInt32LE(code, at);
    }
  }
  return out;
}

/** A complete WAV file in memory. */
export function buildWav(channels: Float32Array[], options: WavWriteOptions): Buffer {
  const o = { encoding: 'pcm' as const, bits: 24, ...options };
  const data = encodeSamples(channels, o.encoding, o.bits, o.validBits ?? o.bits);
  const frames = channels[0]?.length ?? 0;
  const parts: Buffer[] = [];
  if (o.rf64) {
    const ds64 = Buffer.alloc(28);
    // Sizes filled in below once the whole file length is known.
    parts.push(chunk('ds64', ds64));
  }
  parts.push(chunk('fmt ', fmtBody(o, channels.length)));
  if (o.fact) {
    const fact = Buffer.alloc(4);
    fact.writeUInt32LE(frames, 0);
    parts.push(chunk('fact', fact));
  }
  if (o.bext) parts.push(chunk('bext', bextBody(o.bext.timeReference, o.bext.description)));
  for (const extra of o.chunksBefore ?? []) parts.push(chunk(extra.id, extra.body, o.omitPadding));
  parts.push(chunk('data', data, o.omitPadding, o.rf64 ? 0xffffffff : o.dataSizeField));
  for (const extra of o.chunksAfter ?? []) parts.push(chunk(extra.id, extra.body, o.omitPadding));
  const body = Buffer.concat(parts);
  const header = Buffer.alloc(12);
  header.write(o.rf64 ?? 'RIFF', 0, 4, 'latin1');
  header.writeUInt32LE(o.rf64 ? 0xffffffff : Math.min(0xffffffff, body.length + 4), 4);
  header.write('WAVE', 8, 4, 'latin1');
  const file = Buffer.concat([header, body]);
  if (o.rf64) {
    // ds64 body starts after the 12-byte header and its own 8-byte chunk header.
    file.writeBigUInt64LE(BigInt(file.length - 8), 20);
    file.writeBigUInt64LE(BigInt(data.length), 28);
    file.writeBigUInt64LE(BigInt(frames), 36);
    file.writeUInt32LE(0, 44);
  }
  return file;
}

export async function writeWav(path: string, channels: Float32Array[], options: WavWriteOptions): Promise<void> {
  await writeFile(path, buildWav(channels, options));
}

// ---- signals -------------------------------------------------------------------------------------

/** Small seeded PRNG (mulberry32) so test signals are the same on every run. */
export function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function sine(opts: { sampleRate: number; seconds: number; freq: number; amplitude: number; phaseDeg?: number }): Float32Array {
  const n = Math.round(opts.seconds * opts.sampleRate);
  const out = new Float32Array(n);
  const w = (2 * Math.PI * opts.freq) / opts.sampleRate;
  const phase = ((opts.phaseDeg ?? 0) * Math.PI) / 180;
  for (let i = 0; i < n; i++) out[i] = opts.amplitude * Math.sin(w * i + phase);
  return out;
}

export function dbToGain(db: number): number {
  return 10 ** (db / 20);
}

export function concat(...parts: Float32Array[]): Float32Array {
  const out = new Float32Array(parts.reduce((n, p) => n + p.length, 0));
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}

export type DrumVoice = 'kick' | 'snare' | 'hat' | 'tom';

/** One hit of a drum-like voice: pitched thump with a click, tone plus noise, or filtered noise. */
export function drumHit(voice: DrumVoice, sampleRate: number, rand: () => number, velocity = 1): Float32Array {
  const seconds = voice === 'hat' ? 0.12 : voice === 'snare' ? 0.35 : 0.6;
  const n = Math.round(seconds * sampleRate);
  const out = new Float32Array(n);
  let phase = 0;
  let last = 0;
  for (let i = 0; i < n; i++) {
    const t = i / sampleRate;
    const noise = rand() * 2 - 1;
    let v = 0;
    if (voice === 'kick') {
      const freq = 48 + 90 * Math.exp(-t / 0.03);
      phase += (2 * Math.PI * freq) / sampleRate;
      v = Math.sin(phase) * Math.exp(-t / 0.18) + 0.4 * noise * Math.exp(-t / 0.004);
    } else if (voice === 'tom') {
      const freq = 95 + 40 * Math.exp(-t / 0.05);
      phase += (2 * Math.PI * freq) / sampleRate;
      v = Math.sin(phase) * Math.exp(-t / 0.25) + 0.25 * noise * Math.exp(-t / 0.01);
    } else if (voice === 'snare') {
      phase += (2 * Math.PI * 190) / sampleRate;
      v = 0.6 * Math.sin(phase) * Math.exp(-t / 0.06) + 0.7 * noise * Math.exp(-t / 0.09);
    } else {
      // Differenced noise tilts the spectrum up, like a cymbal.
      v = (noise - last) * 0.5 * Math.exp(-t / 0.03);
      last = noise;
    }
    out[i] = v * velocity;
  }
  return out;
}

export interface HitEvent {
  voice: DrumVoice;
  frame: number;
  velocity: number;
  /** Which drum of a voice (toms 0..2), for rendering one tom per close mic. */
  index: number;
}

/** A plain rock pattern on a tempo grid: kick on 1 and 3, snare on 2 and 4, hats on eighths, a tom fill every 4 bars. */
export function rockPattern(opts: { sampleRate: number; seconds: number; tempo: number; seed: number }): HitEvent[] {
  const rand = random(opts.seed);
  const beat = (60 / opts.tempo) * opts.sampleRate;
  const beats = Math.floor(opts.seconds / (60 / opts.tempo));
  const events: HitEvent[] = [];
  const v = () => 0.75 + 0.25 * rand();
  for (let b = 0; b < beats; b++) {
    const at = Math.round(b * beat);
    const inBar = b % 4;
    const fillBar = Math.floor(b / 4) % 4 === 3;
    if (inBar === 0 || inBar === 2) events.push({ voice: 'kick', frame: at, velocity: v(), index: 0 });
    if (inBar === 1 || (inBar === 3 && !fillBar)) events.push({ voice: 'snare', frame: at, velocity: v(), index: 0 });
    if (fillBar && inBar === 3) {
      for (let k = 0; k < 4; k++) events.push({ voice: 'tom', frame: at + Math.round((k * beat) / 4), velocity: v(), index: Math.min(2, k) });
    } else {
      events.push({ voice: 'hat', frame: at, velocity: v() * 0.6, index: 0 });
      events.push({ voice: 'hat', frame: at + Math.round(beat / 2), velocity: v() * 0.4, index: 0 });
    }
  }
  return events;
}

export interface MicPickup {
  voice: DrumVoice;
  /** Tom index, or -1 for every drum of that voice. */
  index?: number;
  gain: number;
  delaySamples: number;
  /** −1 for a mic facing the other way (snare bottom). */
  polarity?: 1 | -1;
}

/** Renders one mic: each hit's template, scaled, delayed and signed as that mic hears it, over a noise floor. */
export function renderMic(opts: {
  sampleRate: number;
  frames: number;
  events: HitEvent[];
  pickups: MicPickup[];
  seed: number;
  noiseFloorDb?: number;
  templates: Map<DrumVoice, Float32Array[]>;
}): Float32Array {
  const out = new Float32Array(opts.frames);
  const rand = random(opts.seed);
  const floor = dbToGain(opts.noiseFloorDb ?? -80);
  for (let i = 0; i < out.length; i++) out[i] = (rand() * 2 - 1) * floor;
  opts.events.forEach((event, e) => {
    for (const p of opts.pickups) {
      if (p.voice !== event.voice || (p.index !== undefined && p.index !== -1 && p.index !== event.index)) continue;
      const variants = opts.templates.get(event.voice) ?? [];
      const template = variants[e % variants.length];
      if (!template) continue;
      const g = p.gain * event.velocity * (p.polarity ?? 1);
      const start = event.frame + p.delaySamples;
      const stop = Math.min(out.length, start + template.length);
      for (let i = Math.max(0, start); i < stop; i++) out[i] += g * template[i - start];
    }
  });
  return out;
}

export function drumTemplates(sampleRate: number, seed: number, variants = 6): Map<DrumVoice, Float32Array[]> {
  const rand = random(seed);
  const voices: DrumVoice[] = ['kick', 'snare', 'hat', 'tom'];
  return new Map(voices.map((voice) => [voice, Array.from({ length: variants }, () => drumHit(voice, sampleRate, rand))]));
}

export interface KitStem {
  name: string;
  samples: Float32Array;
}

/**
 * A 12-mic kit recording of the rock pattern: close mics, overheads and rooms, each hearing every drum
 * with a level, a delay (distance at 343 m/s) and a polarity of its own. The snare bottom mic faces up
 * (inverted), kick out sits 30 cm beyond kick in, overheads about 1 m above the snare.
 */
export function renderKit(opts: { sampleRate: number; seconds: number; tempo: number; seed: number }): KitStem[] {
  const { sampleRate } = opts;
  const frames = Math.round(opts.seconds * sampleRate);
  const events = rockPattern(opts);
  const templates = drumTemplates(sampleRate, opts.seed + 1);
  const ms = (m: number) => Math.round((m / 1000) * sampleRate);
  const mic = (name: string, pickups: MicPickup[], i: number): KitStem => ({
    name,
    samples: renderMic({ sampleRate, frames, events, pickups, seed: opts.seed + 100 + i, templates }),
  });
  const bleed = (gain: number, delayMs: number): MicPickup[] => [
    { voice: 'kick', gain: gain * 0.5, delaySamples: ms(delayMs) },
    { voice: 'snare', gain, delaySamples: ms(delayMs) },
    { voice: 'hat', gain, delaySamples: ms(delayMs) },
    { voice: 'tom', gain: gain * 0.7, delaySamples: ms(delayMs) },
  ];
  return [
    mic('Kick In.wav', [{ voice: 'kick', gain: 0.7, delaySamples: 0 }, { voice: 'snare', gain: 0.05, delaySamples: ms(2) }], 0),
    mic('Kick Out.wav', [{ voice: 'kick', gain: 0.6, delaySamples: ms(0.9) }, { voice: 'snare', gain: 0.06, delaySamples: ms(2.5) }], 1),
    mic('Snare Top.wav', [{ voice: 'snare', gain: 0.6, delaySamples: 0 }, { voice: 'hat', gain: 0.1, delaySamples: ms(0.6) }, { voice: 'kick', gain: 0.08, delaySamples: ms(1.5) }], 2),
    mic('Snare Bottom.wav', [{ voice: 'snare', gain: 0.6, delaySamples: ms(0.4), polarity: -1 }, { voice: 'kick', gain: 0.1, delaySamples: ms(1.2) }], 3),
    mic('HH.wav', [{ voice: 'hat', gain: 0.8, delaySamples: 0 }, { voice: 'snare', gain: 0.15, delaySamples: ms(0.7) }], 4),
    mic('Tom 1.wav', [{ voice: 'tom', index: 0, gain: 0.6, delaySamples: 0 }, { voice: 'snare', gain: 0.1, delaySamples: ms(1) }], 5),
    mic('Tom 2.wav', [{ voice: 'tom', index: 1, gain: 0.6, delaySamples: 0 }, { voice: 'snare', gain: 0.1, delaySamples: ms(1.1) }], 6),
    mic('FT.wav', [{ voice: 'tom', index: 2, gain: 0.6, delaySamples: 0 }, { voice: 'snare', gain: 0.08, delaySamples: ms(1.4) }], 7),
    mic('OH L.wav', bleed(0.35, 3), 8),
    mic('OH R.wav', bleed(0.3, 3.4), 9),
    mic('Room L.wav', bleed(0.2, 14), 10),
    mic('Room R.wav', bleed(0.18, 15), 11),
  ];
}
