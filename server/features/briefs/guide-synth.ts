// A demo guide track of our own: a click on every beat (accented on the one) over a plain bass-like tone
// that walks root–fifth–octave–fifth, one note per bar. Synthesised here; no recording from anywhere.

import { encodeWav16Mono } from '../../audio/wav-encode';

export type GuideSynthOptions = { seconds: number; tempoBpm: number; rootHz: number; sampleRate?: number; beatsPerBar?: number };

const TWO_PI = 2 * Math.PI;
const BAR_STEPS = [1, 1.5, 2, 1.5];

function clickAt(t: number, accented: boolean): number {
  // A short decaying burst at 1.5 kHz (2 kHz on the one) is what common metronome clicks sound like.
  if (t < 0 || t > 0.03) return 0;
  return Math.sin(TWO_PI * (accented ? 2000 : 1500) * t) * Math.exp(-t * 180) * 0.5;
}

function bassAt(t: number, hz: number, sinceNote: number): number {
  // A fundamental with a little second harmonic, plucked: quick attack, slow decay.
  const env = Math.min(1, sinceNote * 200) * Math.exp(-sinceNote * 1.2);
  return (Math.sin(TWO_PI * hz * t) + 0.3 * Math.sin(TWO_PI * 2 * hz * t)) * env * 0.35;
}

/** Mono float samples in −1…1. */
export function synthGuide(opts: GuideSynthOptions): Float32Array {
  const rate = opts.sampleRate ?? 44100;
  const beatsPerBar = opts.beatsPerBar ?? 4;
  const beat = 60 / opts.tempoBpm;
  const bar = beat * beatsPerBar;
  const out = new Float32Array(Math.round(opts.seconds * rate));
  for (let i = 0; i < out.length; i++) {
    const t = i / rate;
    const beatIndex = Math.floor(t / beat);
    const barIndex = Math.floor(t / bar);
    const hz = opts.rootHz * BAR_STEPS[barIndex % BAR_STEPS.length];
    out[i] = clickAt(t - beatIndex * beat, beatIndex % beatsPerBar === 0) + bassAt(t, hz, t - barIndex * bar);
  }
  return out;
}

export function guideWav(opts: GuideSynthOptions): Buffer {
  const rate = opts.sampleRate ?? 44100;
  return encodeWav16Mono(synthGuide({ ...opts, sampleRate: rate }), rate);
}
