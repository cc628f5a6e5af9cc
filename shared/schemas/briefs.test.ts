import { describe, expect, it } from 'vitest';
import { addDays, isCalendarDate, todayIn } from './briefs';

describe('brief calendar dates', () => {
  it('adds days across month, year and leap-day boundaries', () => {
    expect(addDays('2026-12-01', 28)).toBe('2026-12-29');
    expect(addDays('2026-12-20', 28)).toBe('2027-01-17');
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2027-02-28', 1)).toBe('2027-03-01');
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28');
  });

  it('is not moved by a clock change in the songwriter’s zone (the last Sunday of March in Europe)', () => {
    expect(addDays('2027-03-27', 2)).toBe('2027-03-29');
  });

  it('reads today in the songwriter’s zone, not the server’s', () => {
    const lateUtc = new Date('2026-12-01T23:30:00Z');
    expect(todayIn('UTC', lateUtc)).toBe('2026-12-01');
    expect(todayIn('Pacific/Auckland', lateUtc)).toBe('2026-12-02');
    expect(isCalendarDate('2026-02-29')).toBe(false);
  });
});
