import { describe, expect, it } from 'vitest';
import { moveChannel, templateChannels } from './channel-defaults';

describe('moveChannel', () => {
  it('moves a channel down and renumbers the list top to bottom', () => {
    const moved = moveChannel(templateChannels('four_channel'), 0, 2);
    expect(moved.map((c) => [c.number, c.source])).toEqual([
      [1, 'snare_top'],
      [2, 'overhead_l'],
      [3, 'kick_in'],
      [4, 'overhead_r'],
    ]);
  });

  it('fills the text fields the template leaves out', () => {
    expect(templateChannels('four_channel')[0]).toMatchObject({ model: '', note: '', aim: expect.any(String) });
  });
});
