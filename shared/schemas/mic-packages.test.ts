import { describe, expect, it } from 'vitest';
import { channelsFromTemplate } from '../mic-package/templates';
import { micPackageInputSchema, micPackageInputSchemaForRoom, micPackageUpdateInputSchema, validatePackageAgainstRoom } from './mic-packages';

function twelveChannelPackage() {
  return { name: 'Full kit', priceMinor: 15_000, currency: 'EUR', channels: channelsFromTemplate('twelve_channel') };
}

const paths = (result: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  result.success ? [] : (result.error?.issues ?? []).map((i) => i.path.join('.'));

describe('micPackageInputSchema', () => {
  it('accepts a package built from a template', () => {
    const parsed = micPackageInputSchema.parse(twelveChannelPackage());
    expect(parsed.channels).toHaveLength(12);
    expect(parsed.channels[3]).toMatchObject({ source: 'snare_bottom', lowCut: true, polarityInvert: true });
  });

  it('fills empty aim, model and note and a missing distance', () => {
    const parsed = micPackageInputSchema.parse({
      name: 'Minimal',
      priceMinor: 0,
      currency: 'EUR',
      channels: [{ number: 1, source: 'room_mono', micType: 'ribbon', pattern: 'figure_eight', lowCut: false, polarityInvert: false }],
    });
    expect(parsed.channels[0]).toMatchObject({ distanceCm: null, aim: '', model: '', note: '' });
  });

  it('gives field errors for distances out of range, long model names and unknown sources', () => {
    const pkg = twelveChannelPackage();
    pkg.channels[0] = { ...pkg.channels[0], distanceCm: 0.2 };
    pkg.channels[1] = { ...pkg.channels[1], model: 'x'.repeat(81) };
    (pkg.channels[2] as { source: string }).source = 'cowbell';
    pkg.channels[4] = { ...pkg.channels[4], note: 'n'.repeat(501) };
    pkg.channels[5] = { ...pkg.channels[5], distanceCm: 1200 };
    expect(paths(micPackageInputSchema.safeParse(pkg))).toEqual([
      'channels.0.distanceCm',
      'channels.1.model',
      'channels.2.source',
      'channels.4.note',
      'channels.5.distanceCm',
    ]);
  });

  it('refuses a channel number used twice', () => {
    const pkg = twelveChannelPackage();
    pkg.channels[7] = { ...pkg.channels[7], number: 2 };
    expect(paths(micPackageInputSchema.safeParse(pkg))).toEqual(['channels.7.number']);
  });

  it('checks channels in a partial update', () => {
    expect(micPackageUpdateInputSchema.parse({ priceMinor: 9_000 })).toEqual({ priceMinor: 9_000 });
    expect(micPackageUpdateInputSchema.safeParse({ channels: [] }).success).toBe(false);
  });
});

describe('validatePackageAgainstRoom', () => {
  it('refuses more channels than the room has inputs', () => {
    const issues = validatePackageAgainstRoom(twelveChannelPackage(), { inputs: 8 });
    expect(issues[0]).toEqual({ path: ['channels'], message: 'This package has 12 channels but the room has 8 inputs' });
    expect(issues.slice(1).map((i) => i.path)).toEqual([8, 9, 10, 11].map((i) => ['channels', i, 'number']));
  });

  it('passes a package that fits', () => {
    expect(validatePackageAgainstRoom(twelveChannelPackage(), { inputs: 12 })).toEqual([]);
  });

  it('turns the room rules into field errors in the room-aware schema', () => {
    const result = micPackageInputSchemaForRoom({ inputs: 8 }).safeParse(twelveChannelPackage());
    expect(paths(result)[0]).toBe('channels');
    expect(micPackageInputSchemaForRoom({ inputs: 16 }).safeParse(twelveChannelPackage()).success).toBe(true);
  });
});
