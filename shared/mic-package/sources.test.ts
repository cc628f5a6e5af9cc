import { describe, expect, it } from 'vitest';
import { DRUM_PARTS } from '../stems/parts';
import { isCardioidFamily, listSources, SOURCE_IDS, SOURCES } from './sources';

describe('mic-package sources', () => {
  it('describes every source once as a stem part, so an input list can name the stems', () => {
    expect(DRUM_PARTS.map((p) => p.id)).toEqual([...SOURCE_IDS]);
  });

  it('agrees with the stem parts on role and facing, which decide the expected polarity', () => {
    for (const part of DRUM_PARTS) {
      expect({ role: SOURCES[part.id].role, facing: SOURCES[part.id].facing }, part.id).toEqual({ role: part.role, facing: part.facing });
    }
  });

  it('lists every source once, in the order of SOURCE_IDS', () => {
    expect(listSources().map((s) => s.id)).toEqual([...SOURCE_IDS]);
  });

  it('counts cardioid, supercardioid and hypercardioid as one family', () => {
    expect(['cardioid', 'supercardioid', 'hypercardioid', 'figure_eight', 'omni'].map((p) => isCardioidFamily(p as never))).toEqual([true, true, true, false, false]);
  });
});
