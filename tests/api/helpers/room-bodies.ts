// Valid bodies for the rooms and mic-packages API tests; each test overrides what it is about.
import { channelsFromTemplate } from '@shared/mic-package';

const block = { kind: 'material', materialId: 'painted_block_wall' } as const;

/** REFERENCES.md's 6 × 5 × 3 m room (90 m³), painted block walls, wood floor, gypsum ceiling. */
export function roomBody(overrides: Record<string, unknown> = {}) {
  return {
    name: 'Block room',
    town: 'Testing Town',
    timeZone: 'Europe/Berlin',
    description: 'Painted block walls and a wood floor.',
    dayRateMinor: 40_000,
    halfDayRateMinor: 22_000,
    currency: 'USD',
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
    panels: [],
    openings: [],
    ...overrides,
  };
}

/** Every surface a custom finish with the same coefficient in every band, so the expected RT60 is easy to work out. */
export function uniformRoomBody(alpha: number, overrides: Record<string, unknown> = {}) {
  const finish = { kind: 'custom', coefficients: [alpha, alpha, alpha, alpha, alpha, alpha] };
  return roomBody({
    surfaces: { floor: finish, ceiling: finish, frontWall: finish, backWall: finish, leftWall: finish, rightWall: finish },
    ...overrides,
  });
}

export function packageBody(template: 'four_channel' | 'eight_channel' | 'twelve_channel' = 'twelve_channel', overrides: Record<string, unknown> = {}) {
  return { name: 'Full kit', priceMinor: 12_000, currency: 'USD', channels: channelsFromTemplate(template), ...overrides };
}
