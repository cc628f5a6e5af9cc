import { describe, expect, it } from 'vitest';
import { DRUM_PARTS, nameTokens, relatedPairs, suggestPart } from './parts';

describe('suggestPart', () => {
  const cases: [string, string | null][] = [
    ['Kick In.wav', 'kick_in'],
    ['KIK_OUT.wav', 'kick_out'],
    ['03 Kick.wav', 'kick_in'],
    ['kickout.wav', 'kick_out'],
    ['SN BOT.wav', 'snare_bottom'],
    ['snr_top.wav', 'snare_top'],
    ['Snare.wav', 'snare_top'],
    ['SnareBottom.wav', 'snare_bottom'],
    ['HH.wav', 'hi_hat'],
    ['Hi-Hat.wav', 'hi_hat'],
    ['OH L.wav', 'overhead_l'],
    ['OHR.wav', 'overhead_r'],
    ['Overheads Right.wav', 'overhead_r'],
    ['Tom 1.wav', 'rack_tom_1'],
    ['Tom2.wav', 'rack_tom_2'],
    ['rack tom 3.wav', 'rack_tom_3'],
    ['Hi Tom.wav', 'rack_tom_1'],
    ['FT.wav', 'floor_tom_1'],
    ['Floor Tom 2.wav', 'floor_tom_2'],
    ['Room R.wav', 'room_r'],
    ['ROOM_L.wav', 'room_l'],
    ['Mono Room.wav', 'room_mono'],
    ['song_final_mix.wav', null],
    ['bass guitar DI.wav', null],
  ];
  for (const [name, part] of cases) {
    it(`suggests ${part ?? 'nothing'} for "${name}"`, () => {
      expect(suggestPart(name)).toBe(part);
    });
  }

  it('ignores folders and the extension when splitting a name', () => {
    expect(nameTokens('/uploads/v2/01_KickIn.WAV')).toEqual(['01', 'kick', 'in']);
  });
});

describe('relatedPairs', () => {
  it('pairs kick in/out and snare top/bottom, and expects the bottom snare mic inverted and flipped', () => {
    const pairs = relatedPairs(['kick_in', 'kick_out', 'snare_top', 'snare_bottom']);
    expect(pairs).toEqual([
      { a: 'kick_in', b: 'kick_out', kind: 'same_drum', expectInverted: false, flip: 'kick_out', judgePolarity: true },
      { a: 'snare_top', b: 'snare_bottom', kind: 'same_drum', expectInverted: true, flip: 'snare_bottom', judgePolarity: true },
    ]);
  });

  it('pairs every close mic with each overhead but leaves rooms out', () => {
    const pairs = relatedPairs(['snare_top', 'hi_hat', 'kick_in', 'overhead_l', 'overhead_r', 'room_l']);
    expect(pairs.filter((p) => p.kind === 'close_overhead')).toHaveLength(6);
    expect(pairs.some((p) => p.a === 'room_l' || p.b === 'room_l')).toBe(false);
    expect(pairs.find((p) => p.a === 'kick_in')?.judgePolarity).toBe(false);
  });

  it('has a label for every part id', () => {
    expect(DRUM_PARTS.every((p) => p.label.length > 0)).toBe(true);
  });
});
