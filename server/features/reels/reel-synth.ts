// Our own drum-like audio for the demo reels: no recordings from anywhere. A kick is a pitched thump
// (a sine swept down with a fast decay), a snare a noise burst over a low tone, a hi-hat a short burst of
// high-passed noise, placed on a tempo grid. Written as 16-bit PCM mono WAV.

import { encodeWav16Mono } from '../../audio/wav-encode';

export type ReelFeel = 'straight' | 'half-time' | 'shuffle' | 'four-on-the-floor';

export type ReelSynthOptions = { seconds: number; tempo: number; sampleRate?: 44100 | 48000; seed?: number; feel?: ReelFeel };

/** A small deterministic PRNG (mulberry32), so a seed always renders the same file. */
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function addKick(out: Float32Array, at: number, sr: number, gain: number): void {
  const length = Math.floor(0.35 * sr);
  let phase = 0;
  for (let i = 0; i < length && at + i < out.length; i++) {
    const t = i / sr;
    const freq = 48 + 90 * Math.exp(-t * 28);
    phase += (2 * Math.PI * freq) / sr;
    out[at + i] += gain * Math.sin(phase) * Math.exp(-t * 9);
  }
}

function addSnare(out: Float32Array, at: number, sr: number, gain: number, rand: () => number): void {
  const length = Math.floor(0.25 * sr);
  for (let i = 0; i < length && at + i < out.length; i++) {
    const t = i / sr;
    const noise = (rand() * 2 - 1) * Math.exp(-t * 18);
    const body = Math.sin(2 * Math.PI * 185 * t) * Math.exp(-t * 30);
    out[at + i] += gain * (0.75 * noise + 0.4 * body);
  }
}

function addHat(out: Float32Array, at: number, sr: number, gain: number, rand: () => number): void {
  const length = Math.floor(0.06 * sr);
  let previous = 0;
  for (let i = 0; i < length && at + i < out.length; i++) {
    const n = rand() * 2 - 1;
    // First difference of white noise: a crude high-pass that leaves the hiss of a closed hat.
    out[at + i] += gain * (n - previous) * 0.5 * Math.exp(-(i / sr) * 70);
    previous = n;
  }
}

type Hit = { step: number; voice: 'kick' | 'snare' | 'hat'; gain: number };

/** One bar as hits on an eighth-note grid (step 0–7); a shuffle delays the off-beats. */
function barPattern(feel: ReelFeel): Hit[] {
  const hats: Hit[] = Array.from({ length: 8 }, (_, step) => ({ step, voice: 'hat', gain: step % 2 === 0 ? 0.35 : 0.22 }));
  switch (feel) {
    case 'half-time':
      return [...hats, { step: 0, voice: 'kick', gain: 0.9 }, { step: 3, voice: 'kick', gain: 0.6 }, { step: 4, voice: 'snare', gain: 0.8 }];
    case 'four-on-the-floor':
      return [...hats, ...[0, 2, 4, 6].map((step): Hit => ({ step, voice: 'kick', gain: 0.85 })), { step: 2, voice: 'snare', gain: 0.7 }, { step: 6, voice: 'snare', gain: 0.7 }];
    case 'shuffle':
    case 'straight':
      return [...hats, { step: 0, voice: 'kick', gain: 0.9 }, { step: 5, voice: 'kick', gain: 0.6 }, { step: 2, voice: 'snare', gain: 0.8 }, { step: 6, voice: 'snare', gain: 0.8 }];
  }
}

export function synthReelSamples(opts: ReelSynthOptions): Float32Array {
  const sr = opts.sampleRate ?? 44100;
  const rand = prng(opts.seed ?? 1);
  const feel = opts.feel ?? 'straight';
  const out = new Float32Array(Math.round(opts.seconds * sr));
  const eighth = (60 / opts.tempo / 2) * sr;
  const bar = eighth * 8;
  for (let start = 0; start < out.length; start += bar) {
    for (const hit of barPattern(feel)) {
      const swing = feel === 'shuffle' && hit.step % 2 === 1 ? eighth / 3 : 0;
      // A little timing and level variation, so the loop breathes like a player rather than a machine.
      const at = Math.floor(start + hit.step * eighth + swing + (rand() - 0.5) * 0.004 * sr);
      const gain = hit.gain * (0.9 + rand() * 0.2);
      if (at < 0 || at >= out.length) continue;
      if (hit.voice === 'kick') addKick(out, at, sr, gain);
      else if (hit.voice === 'snare') addSnare(out, at, sr, gain, rand);
      else addHat(out, at, sr, gain, rand);
    }
  }
  normalise(out, 0.7);
  return out;
}

function normalise(samples: Float32Array, peak: number): void {
  let max = 0;
  for (const v of samples) max = Math.max(max, Math.abs(v));
  if (max === 0) return;
  const k = peak / max;
  for (let i = 0; i < samples.length; i++) samples[i] *= k;
}

export function synthReelWav(opts: ReelSynthOptions): Buffer {
  return encodeWav16Mono(synthReelSamples(opts), opts.sampleRate ?? 44100);
}
