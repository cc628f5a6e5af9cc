import { describe, expect, it } from 'vitest';
import { MATERIALS, OCTAVE_BANDS_HZ, type BandCoefficients } from './materials';
import {
  axialModes,
  computeAcoustics,
  feetToMetres,
  flagCoincidences,
  grossSurfaceAreas,
  metresToFeet,
  readingFor,
  RoomGeometryError,
  SURFACE_IDS,
  validateRoomGeometry,
  type RoomGeometry,
  type SurfaceFinish,
} from './room-acoustics';

const uniform = (alpha: number): SurfaceFinish => ({
  kind: 'custom',
  coefficients: [alpha, alpha, alpha, alpha, alpha, alpha],
});

function boxRoom(lengthM: number, widthM: number, heightM: number, finish: SurfaceFinish): RoomGeometry {
  return {
    dimensions: { lengthM, widthM, heightM },
    surfaces: Object.fromEntries(SURFACE_IDS.map((s) => [s, finish])) as RoomGeometry['surfaces'],
  };
}

function paintedBlockRoom(): RoomGeometry {
  return {
    dimensions: { lengthM: 6, widthM: 5, heightM: 3 },
    surfaces: {
      floor: { kind: 'material', materialId: 'concrete_floor' },
      ceiling: { kind: 'material', materialId: 'gypsum_board_on_studs' },
      frontWall: { kind: 'material', materialId: 'painted_block_wall' },
      backWall: { kind: 'material', materialId: 'painted_block_wall' },
      leftWall: { kind: 'material', materialId: 'painted_block_wall' },
      rightWall: { kind: 'material', materialId: 'painted_block_wall' },
    },
  };
}

describe('computeAcoustics', () => {
  it('reports volume and total surface of the box', () => {
    const result = computeAcoustics(boxRoom(6, 5, 3, uniform(0.1)));
    expect(result.volumeM3).toBeCloseTo(90, 10);
    expect(result.surfaceM2).toBeCloseTo(2 * (30 + 18 + 15), 10);
  });

  it('sums absorption over the surfaces with their own materials per band', () => {
    const result = computeAcoustics(paintedBlockRoom());
    // floor 30 m², ceiling 30 m², walls 2·15 + 2·18 = 66 m²
    OCTAVE_BANDS_HZ.forEach((hz, b) => {
      const expected =
        30 * MATERIALS.concrete_floor.bands[b] +
        30 * MATERIALS.gypsum_board_on_studs.bands[b] +
        66 * MATERIALS.painted_block_wall.bands[b];
      expect(result.bands[b].hz).toBe(hz);
      expect(result.bands[b].absorptionAreaM2).toBeCloseTo(expected, 10);
      expect(result.bands[b].sabineSec).toBeCloseTo((0.161 * 90) / expected, 10);
      expect(result.bands[b].averageAbsorption).toBeCloseTo(expected / 126, 10);
    });
  });

  it('lets a panel replace the part of the wall it covers', () => {
    const bare = computeAcoustics(paintedBlockRoom());
    const treated = computeAcoustics({
      ...paintedBlockRoom(),
      panels: [{ surface: 'leftWall', areaM2: 4, finish: { kind: 'material', materialId: 'glass_fibre_board_50mm' } }],
    });
    OCTAVE_BANDS_HZ.forEach((_, b) => {
      const gain = 4 * (MATERIALS.glass_fibre_board_50mm.bands[b] - MATERIALS.painted_block_wall.bands[b]);
      expect(treated.bands[b].absorptionAreaM2 - bare.bands[b].absorptionAreaM2).toBeCloseTo(gain, 10);
    });
    expect(treated.surfaceM2).toBeCloseTo(bare.surfaceM2, 10);
    expect(treated.surfaces.find((s) => s.surface === 'leftWall')?.netM2).toBeCloseTo(18 - 4, 10);
  });

  it('counts an open doorway as fully absorbing', () => {
    const closed = computeAcoustics(paintedBlockRoom());
    const open = computeAcoustics({
      ...paintedBlockRoom(),
      openings: [{ type: 'door', surface: 'frontWall', areaM2: 2, finish: { kind: 'open' } }],
    });
    expect(open.bands[2].absorptionAreaM2 - closed.bands[2].absorptionAreaM2).toBeCloseTo(2 * (1 - 0.06), 10);
  });

  it('gives a shorter Eyring than Sabine time, converging in a reflective room', () => {
    const live = computeAcoustics(boxRoom(6, 5, 3, uniform(0.02)));
    const dead = computeAcoustics(boxRoom(6, 5, 3, uniform(0.5)));
    for (const band of [...live.bands, ...dead.bands]) expect(band.eyringSec).toBeLessThan(band.sabineSec);
    expect(live.bands[2].eyringSec / live.bands[2].sabineSec).toBeGreaterThan(0.98);
    expect(dead.bands[2].eyringSec / dead.bands[2].sabineSec).toBeLessThan(0.75);
  });

  it('keeps Eyring finite when every surface absorbs fully', () => {
    const result = computeAcoustics(boxRoom(4, 4, 3, uniform(1)));
    expect(Number.isFinite(result.bands[0].eyringSec)).toBe(true);
    expect(result.bands[0].eyringSec).toBeGreaterThan(0);
  });

  it('recommends Eyring only when the mid-band average absorption is above 0.2', () => {
    expect(computeAcoustics(boxRoom(6, 5, 3, uniform(0.2))).recommended).toBe('sabine');
    const damped = computeAcoustics(boxRoom(6, 5, 3, uniform(0.21)));
    expect(damped.recommended).toBe('eyring');
    expect(damped.recommendedReason).toContain('0.21');
    expect(damped.midBandRt60Sec).toBeCloseTo(damped.bands[2].eyringSec, 10);
  });

  it('reads a heavily treated room as tight and a bare block room as very live', () => {
    const treated = computeAcoustics(boxRoom(5, 4, 3, uniform(0.6)));
    expect(treated.reading).toBe('tight');
    expect(treated.readingText).toMatch(/tight/i);
    const bare = computeAcoustics(paintedBlockRoom());
    expect(bare.midBandRt60Sec).toBeGreaterThan(0.8);
    expect(bare.reading).toBe('very_live');
  });

  it('works out the Schroeder frequency from the recommended mid-band time', () => {
    const result = computeAcoustics(paintedBlockRoom());
    expect(result.schroederHz).toBeCloseTo(2000 * Math.sqrt(result.midBandRt60Sec / 90), 10);
    expect(result.notes[0]).toContain(`${Math.round(result.schroederHz)} Hz`);
  });

  it('notes a bass ring when 125 Hz rings much longer than the middle', () => {
    const boomy: BandCoefficients = [0.05, 0.2, 0.5, 0.5, 0.5, 0.5];
    const result = computeAcoustics(boxRoom(6, 5, 3, { kind: 'custom', coefficients: boomy }));
    expect(result.notes.some((n) => n.includes('125 Hz band rings'))).toBe(true);
    const even = computeAcoustics(boxRoom(6, 5, 3, uniform(0.3)));
    expect(even.notes.some((n) => n.includes('125 Hz band rings'))).toBe(false);
  });

  it('uses the temperature for the modes', () => {
    const cold = computeAcoustics(paintedBlockRoom(), { temperatureC: 0 });
    expect(cold.speedOfSoundMs).toBeCloseTo(331.3, 10);
    expect(cold.modes[0].hz).toBeCloseTo(331.3 / 12, 10);
  });

  it('refuses invalid geometry with the offending fields', () => {
    const bad = { ...paintedBlockRoom(), dimensions: { lengthM: -2, widthM: 5, heightM: 3 } };
    expect(() => computeAcoustics(bad)).toThrow(RoomGeometryError);
  });
});

describe('axial modes', () => {
  it('lists orders up to 4 below 300 Hz, lowest first', () => {
    const modes = axialModes({ lengthM: 6, widthM: 5, heightM: 3 }, 343);
    const length = modes.filter((m) => m.axis === 'length').map((m) => m.order);
    const height = modes.filter((m) => m.axis === 'height');
    expect(length).toEqual([1, 2, 3, 4]);
    expect(height.map((m) => m.order)).toEqual([1, 2, 3, 4].filter((n) => (n * 343) / 6 <= 300));
    for (let i = 1; i < modes.length; i++) expect(modes[i].hz).toBeGreaterThanOrEqual(modes[i - 1].hz);
  });

  it('always lists the first mode of a dimension even above the limit', () => {
    const modes = axialModes({ lengthM: 6, widthM: 5, heightM: 0.5 }, 343, 300);
    expect(modes.filter((m) => m.axis === 'height')).toEqual([{ axis: 'height', order: 1, hz: 343 }]);
  });

  it('flags modes of different dimensions within 5 % as coincident', () => {
    // 6 m length, 2nd order: 2·343/12 = 57.17 Hz; 3 m height, 1st order: 343/6 = 57.17 Hz.
    const modes = computeAcoustics(paintedBlockRoom()).modes;
    const height1 = modes.find((m) => m.axis === 'height' && m.order === 1);
    expect(height1?.coincidentWith).toEqual([expect.objectContaining({ axis: 'length', order: 2 })]);
    // 5 m width, 1st order 34.3 Hz vs 6 m length 1st order 28.6 Hz: 20 % apart, not coincident.
    const length1 = modes.find((m) => m.axis === 'length' && m.order === 1);
    expect(length1?.coincidentWith).toEqual([]);
  });

  it('notes each group of coincident modes once', () => {
    // 6 × 5 × 3 m: length 2 and height 1 meet at 57.2 Hz, length 4 and height 2 at 114.3 Hz.
    const notes = computeAcoustics(paintedBlockRoom()).notes.filter((n) => n.startsWith('Modes of'));
    expect(notes).toEqual([
      'Modes of the length and height fall together near 57 Hz: notes around there may boom.',
      'Modes of the length and height fall together near 114 Hz: notes around there may boom.',
    ]);
  });

  it('uses the lower mode as the base of the 5 % tolerance', () => {
    const flagged = flagCoincidences([
      { hz: 100, axis: 'length', order: 1 },
      { hz: 105, axis: 'width', order: 1 },
      { hz: 105.1, axis: 'height', order: 1 },
    ]);
    expect(flagged[0].coincidentWith.map((m) => m.axis)).toEqual(['width']);
    expect(flagged[1].coincidentWith.map((m) => m.axis)).toEqual(['length', 'height']);
  });
});

describe('readingFor', () => {
  it('applies the stated thresholds at their edges', () => {
    expect(readingFor(0.29)).toBe('tight');
    expect(readingFor(0.3)).toBe('controlled');
    expect(readingFor(0.49)).toBe('controlled');
    expect(readingFor(0.5)).toBe('lively');
    expect(readingFor(0.79)).toBe('lively');
    expect(readingFor(0.8)).toBe('very_live');
  });
});

describe('validateRoomGeometry', () => {
  it('accepts a complete room', () => {
    expect(validateRoomGeometry(paintedBlockRoom())).toEqual([]);
  });

  it('points at a negative or missing dimension', () => {
    const issues = validateRoomGeometry({ ...paintedBlockRoom(), dimensions: { lengthM: 6, widthM: 0, heightM: Number.NaN } });
    expect(issues.map((i) => i.path)).toEqual([
      ['dimensions', 'widthM'],
      ['dimensions', 'heightM'],
    ]);
  });

  it('points at each custom coefficient outside 0–1', () => {
    const room = paintedBlockRoom();
    room.surfaces.ceiling = { kind: 'custom', coefficients: [0.1, 0.2, 1.2, 0.3, -0.1, 0.5] };
    expect(validateRoomGeometry(room).map((i) => i.path)).toEqual([
      ['surfaces', 'ceiling', 'coefficients', 2],
      ['surfaces', 'ceiling', 'coefficients', 4],
    ]);
  });

  it('refuses panels and openings that add up to more than their surface', () => {
    const room: RoomGeometry = {
      ...paintedBlockRoom(),
      panels: [{ surface: 'frontWall', areaM2: 10, finish: { kind: 'material', materialId: 'glass_fibre_board_50mm' } }],
      openings: [{ type: 'window', surface: 'frontWall', areaM2: 6, finish: { kind: 'material', materialId: 'window_glass' } }],
    };
    const issues = validateRoomGeometry(room);
    expect(issues).toHaveLength(1);
    expect(issues[0].path).toEqual(['openings', 0, 'areaM2']);
    expect(issues[0].message).toContain('15.0 m²');
  });

  it('refuses a room in which nothing absorbs in some band', () => {
    const issues = validateRoomGeometry(boxRoom(5, 4, 3, { kind: 'custom', coefficients: [0, 0.1, 0.1, 0.1, 0.1, 0.1] }));
    expect(issues).toEqual([{ path: ['surfaces'], message: expect.stringContaining('125 Hz') }]);
  });

  it('refuses an unknown material id', () => {
    const room = paintedBlockRoom();
    (room.surfaces.floor as { kind: 'material'; materialId: string }).materialId = 'moon_rock';
    expect(validateRoomGeometry(room)[0].path).toEqual(['surfaces', 'floor', 'materialId']);
  });
});

describe('units and areas', () => {
  it('converts feet with the exact international foot', () => {
    expect(feetToMetres(10)).toBeCloseTo(3.048, 12);
    expect(metresToFeet(feetToMetres(17.5))).toBeCloseTo(17.5, 12);
  });

  it('assigns end walls the width and side walls the length', () => {
    const areas = grossSurfaceAreas({ lengthM: 6, widthM: 5, heightM: 3 });
    expect(areas).toEqual({ floor: 30, ceiling: 30, frontWall: 15, backWall: 15, leftWall: 18, rightWall: 18 });
  });
});
