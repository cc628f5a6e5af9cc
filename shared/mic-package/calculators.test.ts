import { describe, expect, it } from 'vitest';
import {
  closeMicOverheadOffsets,
  combNotchesHz,
  delayForDistance,
  distanceForDelay,
  firstCombNotchHz,
  neighbourKey,
  threeToOneChecks,
} from './calculators';
import { channelsFromTemplate, defaultChannel } from './templates';
import type { MicChannel } from './sources';

const C20 = 331.3 + 0.606 * 20;

describe('delayForDistance', () => {
  it('turns a distance difference into ms, samples and the first notch', () => {
    const d = delayForDistance(34.342);
    expect(d.ms).toBeCloseTo(1, 6);
    expect(d.samples).toBeCloseTo(48, 4);
    expect(d.firstNotchHz).toBeCloseTo(500, 3);
  });

  it('counts samples at the session rate', () => {
    expect(delayForDistance(100, { sampleRate: 96_000 }).samples).toBeCloseTo((1 / C20) * 96_000, 8);
  });

  it('keeps the sign of a negative difference but not of the notch', () => {
    const d = delayForDistance(-50);
    expect(d.ms).toBeLessThan(0);
    expect(d.firstNotchHz).toBeCloseTo(firstCombNotchHz(Math.abs(d.ms)), 10);
  });

  it('has no notch without a delay', () => {
    expect(delayForDistance(0).firstNotchHz).toBeNull();
  });

  it('inverts back to a distance', () => {
    expect(distanceForDelay(delayForDistance(27).ms)).toBeCloseTo(27, 10);
  });

  it('refuses a sample rate of zero', () => {
    expect(() => delayForDistance(10, { sampleRate: 0 })).toThrow(RangeError);
  });
});

describe('combNotchesHz', () => {
  it('lists the odd multiples of the first notch', () => {
    expect(combNotchesHz(1, 3000)).toEqual([500, 1500, 2500]);
  });
});

describe('closeMicOverheadOffsets', () => {
  it('expects the overheads to hear each close-miked drum later by the distance difference', () => {
    const offsets = closeMicOverheadOffsets(channelsFromTemplate('four_channel'));
    // kick in (15 cm) and snare top (4 cm) against two overheads at 100 cm.
    expect(offsets).toHaveLength(4);
    const snareLeft = offsets.find((o) => o.closeSource === 'snare_top' && o.overheadSource === 'overhead_l')!;
    expect(snareLeft.distanceCm).toBe(96);
    expect(snareLeft.ms).toBeCloseTo((0.96 / C20) * 1000, 10);
  });

  it('skips mics without a distance', () => {
    const channels = channelsFromTemplate('four_channel').map((c) => (c.source === 'kick_in' ? { ...c, distanceCm: null } : c));
    expect(closeMicOverheadOffsets(channels).map((o) => o.closeSource)).toEqual(['snare_top', 'snare_top']);
  });
});

describe('threeToOneChecks', () => {
  const snare: MicChannel = { ...defaultChannel('snare_top', 1), distanceCm: 4 };
  const hat: MicChannel = { ...defaultChannel('hi_hat', 2), distanceCm: 10 };

  it('passes neighbours far enough apart for their distances', () => {
    const [check] = threeToOneChecks([snare, hat], { [neighbourKey('snare_top', 'hi_hat')]: 40 });
    expect(check).toMatchObject({ spacingCm: 40, spacingAssumed: false, requiredSpacingCm: 30, ok: true });
    expect(check.ratio).toBeCloseTo(4, 10);
  });

  it('warns when the farther mic breaks 3:1', () => {
    const [check] = threeToOneChecks([snare, { ...hat, distanceCm: 18 }], { 'hi_hat|snare_top': 40 });
    expect(check.ok).toBe(false);
    expect(check.requiredSpacingCm).toBe(54);
    expect(check.message).toContain('54 cm');
  });

  it('falls back to a typical spacing and says so', () => {
    const [check] = threeToOneChecks([snare, hat]);
    expect(check.spacingAssumed).toBe(true);
    expect(check.message).toContain('typical spacing');
  });

  it('only checks neighbours with both distances given', () => {
    expect(threeToOneChecks([snare, { ...hat, distanceCm: null }])).toEqual([]);
    expect(threeToOneChecks([snare, defaultChannel('floor_tom_2', 3)])).toEqual([]);
  });

  it('flags the hi-hat of the 12-channel template against the snare at the typical spacing', () => {
    const failing = threeToOneChecks(channelsFromTemplate('twelve_channel')).filter((c) => !c.ok);
    expect(failing.map((c) => [c.sourceA, c.sourceB])).toEqual([['snare_top', 'hi_hat']]);
  });
});
