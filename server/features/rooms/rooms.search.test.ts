import { describe, expect, it } from 'vitest';
import { roomSearchQuerySchema } from '@shared/schemas/rooms';
import { toRoomSearchFilters } from './rooms.service';

const filtersOf = (query: Record<string, string>) => toRoomSearchFilters(roomSearchQuerySchema.parse(query));

describe('toRoomSearchFilters', () => {
  it('turns a day rate typed in major units into minor units of that currency', () => {
    expect(filtersOf({ maxDayRate: '450.5', currency: 'EUR' }).maxDayRateMinor).toBe(45_050);
    expect(filtersOf({ maxDayRate: '30000', currency: 'JPY' }).maxDayRateMinor).toBe(30_000);
  });

  it('maps a time zone band to its standard-offset range and pages from 1', () => {
    const f = filtersOf({ tzBand: 'americas', page: '3', pageSize: '10' });
    expect(f.offsetRange).toEqual({ min: -720, max: -61 });
    expect([f.limit, f.offset]).toEqual([10, 20]);
  });

  it('splits the words of q and keeps at most eight', () => {
    expect(filtersOf({ q: '  stone   hall ' }).words).toEqual(['stone', 'hall']);
    expect(filtersOf({ q: 'a b c d e f g h i j' }).words).toHaveLength(8);
  });
});
