import { describe, expect, it } from 'vitest';
import { computeAcoustics } from '../acoustics/room-acoustics';
import { isIanaTimeZone, roomInputSchema, roomSearchQuerySchema, roomUpdateInputSchema, toRoomGeometry, type RoomInput } from './rooms';

function validRoom(): RoomInput {
  const block = { kind: 'material', materialId: 'painted_block_wall' } as const;
  return {
    name: 'Live room A',
    town: 'Testing Town',
    timeZone: 'Etc/GMT-1',
    description: 'Block walls, wood floor, absorbers on the side walls.',
    dayRateMinor: 45_000,
    halfDayRateMinor: 25_000,
    currency: 'EUR',
    inputs: 16,
    dimensions: { unit: 'm', length: 6, width: 5, height: 3 },
    surfaces: {
      floor: { kind: 'material', materialId: 'wood_floor' },
      ceiling: { kind: 'material', materialId: 'gypsum_board_on_studs' },
      frontWall: block,
      backWall: block,
      leftWall: block,
      rightWall: block,
    },
    panels: [{ surface: 'leftWall', areaM2: 3, finish: { kind: 'material', materialId: 'glass_fibre_board_50mm' } }],
    openings: [{ type: 'door', surface: 'backWall', areaM2: 1.8, finish: { kind: 'custom', coefficients: [0.14, 0.1, 0.06, 0.08, 0.1, 0.1] } }],
  };
}

function fieldPaths(input: unknown): string[] {
  const result = roomInputSchema.safeParse(input);
  return result.success ? [] : result.error.issues.map((i) => i.path.join('.'));
}

describe('roomInputSchema', () => {
  it('accepts a complete room and feeds the acoustics', () => {
    const room = roomInputSchema.parse(validRoom());
    const result = computeAcoustics(toRoomGeometry(room));
    expect(result.volumeM3).toBeCloseTo(90, 10);
  });

  it('converts feet to metres for the acoustics', () => {
    const room = roomInputSchema.parse({ ...validRoom(), dimensions: { unit: 'ft', length: 20, width: 16, height: 10 } });
    const geometry = toRoomGeometry(room);
    expect(geometry.dimensions.lengthM).toBeCloseTo(6.096, 10);
    expect(geometry.dimensions.heightM).toBeCloseTo(3.048, 10);
  });

  it('gives a field error for a negative or absurd dimension', () => {
    expect(fieldPaths({ ...validRoom(), dimensions: { unit: 'm', length: -6, width: 5, height: 3 } })).toEqual(['dimensions.length']);
    expect(fieldPaths({ ...validRoom(), dimensions: { unit: 'm', length: 6, width: 500, height: 3 } })).toEqual(['dimensions.width']);
    expect(fieldPaths({ ...validRoom(), dimensions: { unit: 'm', length: 6, width: 5, height: 1.2 } })).toEqual(['dimensions.height']);
  });

  it('checks the bounds in feet after conversion, with the message in feet', () => {
    const result = roomInputSchema.safeParse({ ...validRoom(), dimensions: { unit: 'ft', length: 4, width: 16, height: 10 } });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]).toMatchObject({ path: ['dimensions', 'length'], message: 'Length must be between 4.9 and 196.9 ft' });
  });

  it('gives a field error for each coefficient outside 0–1', () => {
    const room = validRoom();
    room.surfaces.ceiling = { kind: 'custom', coefficients: [0.1, 1.4, 0.2, 0.2, -0.2, 0.3] };
    expect(fieldPaths(room)).toEqual(['surfaces.ceiling.coefficients.1', 'surfaces.ceiling.coefficients.4']);
  });

  it('refuses a custom finish without six coefficients', () => {
    const room = validRoom() as unknown as { surfaces: { floor: unknown } };
    room.surfaces.floor = { kind: 'custom', coefficients: [0.1, 0.2] };
    expect(fieldPaths(room)).toEqual(['surfaces.floor.coefficients']);
  });

  it('refuses panels and openings larger than the wall they sit on', () => {
    const room = validRoom();
    room.panels = [{ surface: 'frontWall', areaM2: 16, finish: { kind: 'material', materialId: 'glass_fibre_board_50mm' } }];
    expect(fieldPaths(room)).toEqual(['panels.0.areaM2']);
  });

  it('refuses a half-day rate above the day rate, a bad currency and too many inputs', () => {
    expect(fieldPaths({ ...validRoom(), halfDayRateMinor: 50_000 })).toEqual(['halfDayRateMinor']);
    expect(fieldPaths({ ...validRoom(), currency: 'euro' })).toEqual(['currency']);
    expect(fieldPaths({ ...validRoom(), inputs: 300 })).toEqual(['inputs']);
    expect(fieldPaths({ ...validRoom(), dayRateMinor: 12.5 })).toEqual(['dayRateMinor']);
  });

  it('refuses a time zone that is not an IANA name', () => {
    expect(fieldPaths({ ...validRoom(), timeZone: 'Nowhere/Nothing' })).toEqual(['timeZone']);
    expect(fieldPaths({ ...validRoom(), timeZone: '+01:00' })).toEqual(['timeZone']);
    expect(isIanaTimeZone('Etc/GMT+10')).toBe(true);
    expect(isIanaTimeZone('UTC')).toBe(true);
  });
});

describe('roomUpdateInputSchema', () => {
  it('accepts a partial update and still checks the fields it has', () => {
    expect(roomUpdateInputSchema.parse({ dayRateMinor: 50_000 })).toEqual({ dayRateMinor: 50_000 });
    expect(roomUpdateInputSchema.safeParse({ dayRateMinor: 10_000, halfDayRateMinor: 20_000 }).success).toBe(false);
    expect(roomUpdateInputSchema.safeParse({ dimensions: { unit: 'm', length: 0, width: 5, height: 3 } }).success).toBe(false);
  });
});

describe('roomSearchQuerySchema', () => {
  it('reads numbers from a query string, drops empty keys and applies paging defaults', () => {
    expect(roomSearchQuerySchema.parse({ town: 'Testing Town', rtMax: '0.5', minInputs: '12', q: '', minVolume: '' })).toEqual({
      town: 'Testing Town',
      rtMax: 0.5,
      minInputs: 12,
      page: 1,
      pageSize: 20,
    });
  });

  it('refuses an inverted range with the error on the upper bound', () => {
    const result = roomSearchQuerySchema.safeParse({ rtMin: '0.8', rtMax: '0.3' });
    expect(result.error?.issues.map((i) => i.path.join('.'))).toEqual(['rtMax']);
  });

  it('asks for the currency of a highest day rate and refuses an unknown time zone band', () => {
    const noCurrency = roomSearchQuerySchema.safeParse({ maxDayRate: '300' });
    expect(noCurrency.error?.issues.map((i) => i.path.join('.'))).toEqual(['currency']);
    const badBand = roomSearchQuerySchema.safeParse({ tzBand: 'moon' });
    expect(badBand.error?.issues.map((i) => i.path.join('.'))).toEqual(['tzBand']);
    expect(roomSearchQuerySchema.parse({ maxDayRate: '300', currency: 'EUR' })).toMatchObject({ maxDayRate: 300, currency: 'EUR' });
  });
});
