// Reference checks for the room, hearing-safety and mic-package computations. Each title names the
// published source of its check value, as written in /work/shared/REFERENCES.md ("Acoustics and safety",
// from memory unless marked) or in issue 6 for the common-practice placement points.

import { describe, expect, it } from 'vitest';
import {
  axialModeHz,
  axialModes,
  computeAcoustics,
  eyringRt60,
  sabineRt60,
  schroederFrequency,
  speedOfSound,
  SURFACE_IDS,
  type RoomGeometry,
  type SurfaceFinish,
} from '@shared/acoustics';
import { allowedMinutes, OSHA_PEL, permissibleExposure } from '@shared/safety/noise-exposure';
import { channelsFromTemplate, COMMON_DISTANCE_RANGES_CM, TEMPLATE_IDS } from '@shared/mic-package/templates';
import { combNotchesHz, delayForDistance, distanceForDelay, firstCombNotchHz } from '@shared/mic-package/calculators';
import { isCardioidFamily } from '@shared/mic-package/sources';

function uniformBox(lengthM: number, widthM: number, heightM: number, alpha: number): RoomGeometry {
  const finish: SurfaceFinish = { kind: 'custom', coefficients: [alpha, alpha, alpha, alpha, alpha, alpha] };
  return {
    dimensions: { lengthM, widthM, heightM },
    surfaces: Object.fromEntries(SURFACE_IDS.map((s) => [s, finish])) as RoomGeometry['surfaces'],
  };
}

describe('Sabine', () => {
  it('REFERENCES.md Sabine worked example: 6 × 5 × 3 m, V = 90 m³, A = 20 m² → 0.72 s', () => {
    expect(sabineRt60(90, 20)).toBeCloseTo(0.72, 2);
  });

  it('REFERENCES.md Sabine worked example through computeAcoustics (A = 20 m² spread over S = 126 m²)', () => {
    const result = computeAcoustics(uniformBox(6, 5, 3, 20 / 126));
    expect(result.volumeM3).toBeCloseTo(90, 10);
    for (const band of result.bands) {
      expect(band.absorptionAreaM2).toBeCloseTo(20, 10);
      expect(band.sabineSec).toBeCloseTo(0.72, 2);
    }
  });
});

describe('Eyring', () => {
  it('REFERENCES.md Eyring formula, worked by hand: 6 × 5 × 3 m, ᾱ = 0.2 everywhere → 0.515 s (Sabine 0.575 s)', () => {
    // S = 2·(30 + 18 + 15) = 126 m², V = 90 m³. −ln(1 − 0.2) = 0.223144; S·0.223144 = 28.1161 m².
    // Eyring RT60 = 0.161·90 / 28.1161 = 14.49 / 28.1161 = 0.51536 s; Sabine = 14.49 / (126·0.2) = 0.5750 s.
    expect(eyringRt60(90, 126, 0.2)).toBeCloseTo(0.51536, 4);
    const result = computeAcoustics(uniformBox(6, 5, 3, 0.2));
    expect(result.bands[2].eyringSec).toBeCloseTo(0.51536, 4);
    expect(result.bands[2].sabineSec).toBeCloseTo(0.575, 4);
  });

  it('REFERENCES.md Eyring with a fully absorbing ceiling (coefficient capped at 0.99 for the log), worked by hand at 500 Hz', () => {
    // Floor concrete 30 m² × 0.015, ceiling 50 mm glass-fibre board 30 m² × 1.00 → capped 0.99,
    // walls painted block 66 m² × 0.06 (handbook values in REFERENCES.md).
    // A_eyring = 0.45 + 29.7 + 3.96 = 34.11 m²; ᾱ = 34.11/126 = 0.270714; −ln(1 − ᾱ) = 0.315690;
    // RT60 = 14.49 / (126 · 0.315690) = 14.49 / 39.7769 = 0.3643 s. Sabine uses the uncapped 1.00:
    // A = 0.45 + 30 + 3.96 = 34.41 m² → 14.49 / 34.41 = 0.4211 s.
    const room: RoomGeometry = {
      dimensions: { lengthM: 6, widthM: 5, heightM: 3 },
      surfaces: {
        floor: { kind: 'material', materialId: 'concrete_floor' },
        ceiling: { kind: 'material', materialId: 'glass_fibre_board_50mm' },
        frontWall: { kind: 'material', materialId: 'painted_block_wall' },
        backWall: { kind: 'material', materialId: 'painted_block_wall' },
        leftWall: { kind: 'material', materialId: 'painted_block_wall' },
        rightWall: { kind: 'material', materialId: 'painted_block_wall' },
      },
    };
    const band500 = computeAcoustics(room).bands[2];
    expect(band500.hz).toBe(500);
    expect(band500.eyringSec).toBeCloseTo(0.3643, 3);
    expect(band500.sabineSec).toBeCloseTo(0.4211, 3);
  });
});

describe('room modes and Schroeder frequency', () => {
  it('REFERENCES.md axial modes f = n·c/(2L): a 5 m dimension at 343 m/s → 34.3, 68.6, 102.9, 137.2 Hz', () => {
    expect([1, 2, 3, 4].map((n) => axialModeHz(n, 5, 343))).toEqual([34.3, 68.6, 102.9, 137.2].map((f) => expect.closeTo(f, 9)));
    const widthModes = axialModes({ lengthM: 7, widthM: 5, heightM: 3 }, 343).filter((m) => m.axis === 'width');
    expect(widthModes.map((m) => m.hz)).toEqual([34.3, 68.6, 102.9, 137.2].map((f) => expect.closeTo(f, 9)));
  });

  it('REFERENCES.md Schroeder frequency ≈ 2000·√(RT60/V): 0.72 s in 90 m³ → 178.9 Hz', () => {
    // √(0.72 / 90) = √0.008 = 0.0894427 → 2000 · 0.0894427 = 178.885 Hz.
    expect(schroederFrequency(0.72, 90)).toBeCloseTo(178.885, 2);
  });
});

describe('speed of sound', () => {
  it('REFERENCES.md c ≈ 331.3 + 0.606·T: 343 m/s at 20 °C', () => {
    expect(speedOfSound(20)).toBeCloseTo(343.42, 10);
    expect(Math.abs(speedOfSound(20) - 343)).toBeLessThan(0.5);
  });

  it('REFERENCES.md 1 ms ≈ 34.3 cm and one sample at 48 kHz ≈ 7.1 mm', () => {
    expect(distanceForDelay(1)).toBeCloseTo(34.3, 1);
    expect(Math.abs(distanceForDelay(1000 / 48_000) * 10 - 7.1)).toBeLessThan(0.1);
  });
});

describe('noise exposure', () => {
  it('NIOSH 98-126 (1998) REL, 85 dBA and 3 dB exchange: 94 dBA → 1 h', () => {
    expect(permissibleExposure(94).nioshMinutes).toBeCloseTo(60, 10);
  });

  it('NIOSH 98-126 (1998) REL, 85 dBA and 3 dB exchange: 100 dBA → 15 min', () => {
    expect(permissibleExposure(100).nioshMinutes).toBeCloseTo(15, 10);
  });

  it('OSHA 29 CFR 1910.95 PEL, 90 dBA and 5 dB exchange: 95 dBA → 4 h', () => {
    expect(permissibleExposure(95).oshaMinutes).toBeCloseTo(240, 10);
  });

  it('OSHA 29 CFR 1910.95 Table G-16 (from memory): 100 dBA 2 h, 105 dBA 1 h, 110 dBA 0.5 h, 115 dBA 0.25 h', () => {
    expect([100, 105, 110, 115].map((l) => allowedMinutes(l, OSHA_PEL) / 60)).toEqual([2, 1, 0.5, 0.25].map((h) => expect.closeTo(h, 10)));
  });
});

describe('comb filtering', () => {
  it('REFERENCES.md two equal signals delayed by τ cancel at (2k+1)/(2τ): 1 ms → first notch at 500 Hz', () => {
    expect(firstCombNotchHz(1)).toBe(500);
    expect(combNotchesHz(1, 2000)).toEqual([500, 1500]);
  });

  it('REFERENCES.md comb-notch rule from a distance: 34.34 cm at 20 °C → 1 ms → 500 Hz', () => {
    const d = delayForDistance(speedOfSound(20) / 10);
    expect(d.ms).toBeCloseTo(1, 10);
    expect(d.firstNotchHz).toBeCloseTo(500, 8);
  });
});

describe('template defaults', () => {
  it('issue 6 placement guidance (common practice): hi-hat small-diaphragm condenser at 15–20 cm', () => {
    for (const id of TEMPLATE_IDS) {
      for (const ch of channelsFromTemplate(id).filter((c) => c.source === 'hi_hat')) {
        expect(ch.micType).toBe('small_diaphragm_condenser');
        expect(ch.distanceCm).toBeGreaterThanOrEqual(15);
        expect(ch.distanceCm).toBeLessThanOrEqual(20);
      }
    }
  });

  it('issue 6 placement guidance (common practice): snare bottom with low-cut on and polarity inverted', () => {
    const bottoms = TEMPLATE_IDS.flatMap((id) => channelsFromTemplate(id)).filter((c) => c.source === 'snare_bottom');
    expect(bottoms.length).toBeGreaterThan(0);
    for (const ch of bottoms) expect(ch).toMatchObject({ lowCut: true, polarityInvert: true });
  });

  it('issue 6 placement guidance (common practice): snare top a cardioid-family dynamic', () => {
    for (const ch of TEMPLATE_IDS.flatMap((id) => channelsFromTemplate(id)).filter((c) => c.source === 'snare_top')) {
      expect(ch.micType).toBe('dynamic');
      expect(isCardioidFamily(ch.pattern)).toBe(true);
    }
  });

  it('common practice distance ranges (recording guides, from memory): every template distance within its range', () => {
    for (const ch of TEMPLATE_IDS.flatMap((id) => channelsFromTemplate(id))) {
      const range = COMMON_DISTANCE_RANGES_CM[ch.source]!;
      expect(ch.distanceCm).toBeGreaterThanOrEqual(range.min);
      expect(ch.distanceCm).toBeLessThanOrEqual(range.max);
    }
  });
});
