import { describe, expect, it } from 'vitest';
import { expectFor, quarterBeatsPerBar } from './check-expect';

const terms = {
  deliverables: { sampleRate: 48000, bitDepth: '24' as const, stemMode: 'every_mic' as const, stemList: [], roughMix: false },
  tempoBpm: 120,
  timeSignature: '4/4',
  lengthBars: 96,
  lengthSeconds: null,
};

describe('what the delivery check expects from a booking', () => {
  it('counts bars in quarter-note beats, as DAW tempos do (common practice)', () => {
    expect(quarterBeatsPerBar('4/4')).toBe(4);
    expect(quarterBeatsPerBar('6/8')).toBe(3);
    expect(quarterBeatsPerBar('7/8')).toBe(3.5);
    expect(quarterBeatsPerBar('five')).toBeUndefined();
  });

  it('takes rate, depth, tempo and bars from the frozen terms', () => {
    expect(expectFor(terms, null, [])).toEqual({ sampleRate: 48000, bitDepth: 24, tempo: 120, bars: 96, beatsPerBar: 4 });
    expect(expectFor({ ...terms, deliverables: { ...terms.deliverables, bitDepth: '32f' } }, null, []).bitDepth).toBe('32f');
  });

  it('turns a length in seconds into the bars it holds', () => {
    // 200 s at 120 BPM in 3/4: 400 beats / 3 = 133.33 bars.
    expect(expectFor({ ...terms, timeSignature: '3/4', lengthBars: null, lengthSeconds: 200 }, null, []).bars).toBeCloseTo(133.333, 3);
  });

  it('maps the package’s part pairs onto the delivered file names, skipping parts nobody delivered', () => {
    const inputList = { channels: [], checkPairs: [{ a: 'snare_top', b: 'snare_bottom', expectInverted: true }, { a: 'kick_in', b: 'overhead_l' }] };
    const files = [{ name: 'SN top.wav', part: null }, { name: 'bottom mic.wav', part: 'snare_bottom' }, { name: 'Kick.wav', part: 'kick_in' }];
    expect(expectFor(terms, inputList, files).pairs).toEqual([{ a: 'SN top.wav', b: 'bottom mic.wav', expectInverted: true }]);
  });
});
