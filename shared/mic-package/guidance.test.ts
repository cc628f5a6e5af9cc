import { describe, expect, it } from 'vitest';
import { channelWarnings, guidanceFor, PLACEMENT_GUIDANCE } from './guidance';
import { defaultChannel } from './templates';
import type { MicChannel } from './sources';

const codes = (ch: MicChannel) => channelWarnings(ch).map((h) => h.code);

describe('placement guidance', () => {
  it('marks every entry as common practice', () => {
    expect(PLACEMENT_GUIDANCE.length).toBeGreaterThanOrEqual(4);
    for (const entry of PLACEMENT_GUIDANCE) expect(entry.basis).toBe('common practice');
  });

  it("shows a channel's own points before the general ones", () => {
    expect(guidanceFor('hi_hat').map((g) => g.id)).toEqual(['hi_hat', 'general']);
    expect(guidanceFor('rack_tom_1').map((g) => g.id)).toEqual(['general']);
  });

  it('tells the hi-hat mic to stay out of the air from the closing hats', () => {
    const hiHat = guidanceFor('hi_hat')[0];
    expect(hiHat.points.join(' ')).toMatch(/15–20 cm/);
    expect(hiHat.points.join(' ')).toMatch(/air pushed out/);
  });

  it('warns that tall room stands are top-heavy', () => {
    expect(guidanceFor('room_l').at(-1)?.points.join(' ')).toMatch(/top-heavy/);
  });
});

describe('channelWarnings', () => {
  it('hints when the hi-hat mic is not a small-diaphragm condenser', () => {
    expect(codes({ ...defaultChannel('hi_hat', 5), micType: 'dynamic' })).toEqual(['hi_hat_mic_type']);
  });

  it('hints when the hi-hat mic is outside 15–20 cm', () => {
    expect(codes({ ...defaultChannel('hi_hat', 5), distanceCm: 8 })).toEqual(['hi_hat_distance']);
    expect(codes({ ...defaultChannel('hi_hat', 5), distanceCm: 21 })).toEqual(['hi_hat_distance']);
    expect(codes({ ...defaultChannel('hi_hat', 5), distanceCm: 15 })).toEqual([]);
    expect(codes({ ...defaultChannel('hi_hat', 5), distanceCm: null })).toEqual([]);
  });

  it('hints when the snare bottom has no low-cut or no polarity invert', () => {
    const ch = defaultChannel('snare_bottom', 4);
    expect(codes({ ...ch, lowCut: false })).toEqual(['snare_bottom_low_cut']);
    expect(codes({ ...ch, polarityInvert: false })).toEqual(['snare_bottom_polarity']);
    expect(codes({ ...ch, pattern: 'figure_eight' })).toEqual([]);
    expect(codes({ ...ch, pattern: 'omni' })).toEqual(['snare_bottom_pattern']);
  });

  it('hints when the snare top is not a cardioid-family dynamic', () => {
    const ch = defaultChannel('snare_top', 3);
    expect(codes({ ...ch, pattern: 'hypercardioid' })).toEqual([]);
    expect(codes({ ...ch, micType: 'small_diaphragm_condenser' })).toEqual(['snare_top_mic']);
    expect(codes({ ...ch, pattern: 'omni' })).toEqual(['snare_top_mic']);
  });

  it('hints at an unusual distance for other sources', () => {
    const hints = channelWarnings({ ...defaultChannel('floor_tom_1', 7), distanceCm: 40 });
    expect(hints.map((h) => h.code)).toEqual(['distance_unusual']);
    expect(hints[0].message).toContain('40 cm');
    expect(hints[0].basis).toBe('common practice');
  });
});
