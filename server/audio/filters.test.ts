import { describe, expect, it } from 'vitest';
import { butterworthLowPass, kWeightingHighPass, kWeightingShelf, magnitudeAt } from './filters';

describe('K-weighting re-derived from the analog prototypes', () => {
  it('reproduces the 48 kHz stage 1 table (ITU-R BS.1770-4 Annex 1, Table 1)', () => {
    const s = kWeightingShelf(48_000);
    expect(s.b0).toBeCloseTo(1.53512485958697, 12);
    expect(s.b1).toBeCloseTo(-2.69169618940638, 12);
    expect(s.b2).toBeCloseTo(1.19839281085285, 12);
    expect(s.a1).toBeCloseTo(-1.69065929318241, 12);
    expect(s.a2).toBeCloseTo(0.73248077421585, 12);
  });

  it('reproduces the 48 kHz stage 2 table (ITU-R BS.1770-4 Annex 1, Table 2)', () => {
    const h = kWeightingHighPass(48_000);
    expect([h.b0, h.b1, h.b2]).toEqual([1, -2, 1]);
    expect(h.a1).toBeCloseTo(-1.99004745483398, 12);
    expect(h.a2).toBeCloseTo(0.99007225036621, 12);
  });
});

describe('rumble low-pass', () => {
  it('is 3 dB down at 30 Hz and about 24 dB per octave above it (4th-order Butterworth)', () => {
    const lp = butterworthLowPass(1500, 30, 4);
    expect(20 * Math.log10(magnitudeAt(lp, 1500, 30))).toBeCloseTo(-3.01, 1);
    expect(20 * Math.log10(magnitudeAt(lp, 1500, 120))).toBeLessThan(-45);
  });
});
