import { describe, expect, it } from 'vitest';
import { buildLineItems, totalOf } from './quote-lines';

describe('quote line items', () => {
  it('multiplies the per-song fee by the songs and adds the package and rush lines', () => {
    const items = buildLineItems({ perSongFeeMinor: 12_345, songCount: 3, rushFeeMinor: 500, engineerShareMinor: 8_000, packageName: 'Four-mic kit' });
    expect(items.map((i) => [i.kind, i.unitAmount, i.quantity])).toEqual([
      ['per_song', 12_345, 3],
      ['package', 8_000, 1],
      ['rush', 500, 1],
    ]);
    expect(totalOf(items, 'USD')).toBe(12_345 * 3 + 8_000 + 500);
  });

  it('leaves out empty rush and package lines', () => {
    const items = buildLineItems({ perSongFeeMinor: 9_000, songCount: 1, rushFeeMinor: 0, engineerShareMinor: 0, packageName: null });
    expect(items).toEqual([{ kind: 'per_song', label: 'Drum tracks for the song', unitAmount: 9_000, quantity: 1 }]);
  });

  it('refuses a total that one payment could not hold, as a field error', () => {
    const items = buildLineItems({ perSongFeeMinor: 60_000_000, songCount: 2, rushFeeMinor: 0, engineerShareMinor: 0, packageName: null });
    expect(() => totalOf(items, 'USD')).toThrow(expect.objectContaining({ status: 400, code: 'invalid_input' }));
  });
});
