import { describe, expect, it } from 'vitest';
import { delayForDistance } from './calculators';
import { deliveryExpectPairs, expectInverted, facesOpposite, packagePairs } from './pairs';
import { channelsFromTemplate, defaultChannel } from './templates';

describe('packagePairs', () => {
  it('finds the related pairs of the 12-channel template', () => {
    const pairs = packagePairs(channelsFromTemplate('twelve_channel'));
    const kinds = pairs.map((p) => p.kind);
    expect(kinds.filter((k) => k === 'top_bottom')).toHaveLength(1);
    expect(kinds.filter((k) => k === 'in_out')).toHaveLength(1);
    expect(kinds.filter((k) => k === 'overhead_pair')).toHaveLength(1);
    // 8 close mics (kick in/out, snare top/bottom, hi-hat, three toms) × 2 overheads.
    expect(kinds.filter((k) => k === 'close_overhead')).toHaveLength(16);
    expect(pairs.some((p) => p.aSource.startsWith('room') || p.bSource.startsWith('room'))).toBe(false);
  });

  it('expects a snare bottom recorded with the invert switch to match the top', () => {
    const [tb] = packagePairs(channelsFromTemplate('eight_channel')).filter((p) => p.kind === 'top_bottom');
    expect(tb).toMatchObject({ aSource: 'snare_top', bSource: 'snare_bottom', expectInverted: false, expectedLagMs: null });
  });

  it('expects a snare bottom recorded without the invert switch to read inverted against the top', () => {
    const channels = channelsFromTemplate('eight_channel').map((c) => (c.source === 'snare_bottom' ? { ...c, polarityInvert: false } : c));
    const [tb] = packagePairs(channels).filter((p) => p.kind === 'top_bottom');
    expect(tb.expectInverted).toBe(true);
    expect(tb.reason).toMatch(/inverted/);
  });

  it('expects overheads to match each other unless one is switched', () => {
    const l = defaultChannel('overhead_l', 1);
    const r = defaultChannel('overhead_r', 2);
    expect(expectInverted(l, r)).toBe(false);
    expect(expectInverted(l, { ...r, polarityInvert: true })).toBe(true);
    expect(expectInverted({ ...l, polarityInvert: true }, { ...r, polarityInvert: true })).toBe(false);
  });

  it('expects kick in and out to match, and gives no expectation for a kick against the overheads', () => {
    const pairs = packagePairs(channelsFromTemplate('twelve_channel'));
    expect(pairs.find((p) => p.kind === 'in_out')?.expectInverted).toBe(false);
    const kickOverhead = pairs.find((p) => p.kind === 'close_overhead' && p.aSource === 'kick_in');
    expect(kickOverhead?.expectInverted).toBeNull();
  });

  it('expects the snare bottom inverted against the overheads only when its switch is off', () => {
    const pairs = packagePairs(channelsFromTemplate('twelve_channel'));
    const bottomVsOh = pairs.find((p) => p.kind === 'close_overhead' && p.aSource === 'snare_bottom');
    expect(bottomVsOh?.expectInverted).toBe(false);
    const topVsOh = pairs.find((p) => p.kind === 'close_overhead' && p.aSource === 'snare_top');
    expect(topVsOh?.expectInverted).toBe(false);
  });

  it('predicts the lag of the overheads behind a close mic from the distances', () => {
    const pairs = packagePairs(channelsFromTemplate('four_channel'), { sampleRate: 48_000 });
    const snareOh = pairs.find((p) => p.kind === 'close_overhead' && p.aSource === 'snare_top')!;
    expect(snareOh.expectedLagMs).toBeCloseTo(delayForDistance(100 - 4).ms, 10);
  });
});

describe('facesOpposite', () => {
  it('treats up against down as opposite and unknown as no expectation', () => {
    expect(facesOpposite('down', 'up')).toBe(true);
    expect(facesOpposite('down', 'down')).toBe(false);
    expect(facesOpposite('kick_axis', 'kick_axis')).toBe(false);
    expect(facesOpposite('kick_axis', 'down')).toBeNull();
    expect(facesOpposite('unknown', 'down')).toBeNull();
  });
});

describe('deliveryExpectPairs', () => {
  it('hands the delivery check part-id pairs, without an expectation where there is none', () => {
    const channels = channelsFromTemplate('twelve_channel').map((c) => (c.source === 'snare_bottom' ? { ...c, polarityInvert: false } : c));
    const expected = deliveryExpectPairs(packagePairs(channels));
    expect(expected).toContainEqual({ a: 'snare_top', b: 'snare_bottom', expectInverted: true });
    expect(expected).toContainEqual({ a: 'kick_in', b: 'overhead_l' });
    expect(expected).toContainEqual({ a: 'snare_bottom', b: 'overhead_r', expectInverted: true });
  });

  it('collapses two channels on the same source into one pair', () => {
    const channels = [defaultChannel('snare_top', 1), defaultChannel('snare_top', 2), defaultChannel('snare_bottom', 3)];
    expect(deliveryExpectPairs(packagePairs(channels))).toEqual([{ a: 'snare_top', b: 'snare_bottom', expectInverted: false }]);
  });
});
