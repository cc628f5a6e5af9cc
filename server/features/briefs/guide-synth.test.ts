import { describe, expect, it } from 'vitest';
import { guideWav, synthGuide } from './guide-synth';

describe('the demo guide synth', () => {
  it('clicks on every beat: at 120 BPM the loudest moments are 0.5 s apart', () => {
    const rate = 8000;
    const samples = synthGuide({ seconds: 4, tempoBpm: 120, rootHz: 55, sampleRate: rate });
    expect(samples.length).toBe(4 * rate);
    // The click's 1.5–2 kHz burst is the only thing with a sample-to-sample jump this large.
    const jumps: number[] = [];
    for (let i = 1; i < samples.length; i++) if (Math.abs(samples[i] - samples[i - 1]) > 0.3) jumps.push(i / rate);
    const beats = [...new Set(jumps.map((t) => Math.round(t * 2) / 2))];
    expect(beats).toEqual([0, 0.5, 1, 1.5, 2, 2.5, 3, 3.5]);
    expect(Math.max(...samples.map(Math.abs))).toBeLessThanOrEqual(1);
  });

  it('renders the asked length as 16-bit mono at 44.1 kHz by default', () => {
    expect(guideWav({ seconds: 1, tempoBpm: 100, rootHz: 60 }).length).toBe(44 + 44100 * 2);
  });
});
