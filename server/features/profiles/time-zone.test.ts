import { describe, expect, it } from 'vitest';
import { standardOffsetMinutes, utcOffsetMinutesAt } from './time-zone';
import { bandOfOffset } from '@shared/schemas/profiles';

// Offsets are facts of the IANA time zone database (from memory: Berlin CET +1 / CEST +2, Sydney AEST +10 /
// AEDT +11, Kolkata +5:30 without DST, St. John's −3:30 standard).
describe('standard UTC offsets of IANA zones', () => {
  it('takes the winter offset in the northern hemisphere', () => {
    expect(utcOffsetMinutesAt('Europe/Berlin', new Date(Date.UTC(2025, 6, 1)))).toBe(120);
    expect(standardOffsetMinutes('Europe/Berlin', 2025)).toBe(60);
    expect(standardOffsetMinutes('America/Chicago', 2025)).toBe(-360);
  });

  it('takes the July offset in the southern hemisphere, where July is winter', () => {
    expect(utcOffsetMinutesAt('Australia/Sydney', new Date(Date.UTC(2025, 0, 1)))).toBe(660);
    expect(standardOffsetMinutes('Australia/Sydney', 2025)).toBe(600);
  });

  it('reads half-hour offsets and UTC itself', () => {
    expect(standardOffsetMinutes('Asia/Kolkata', 2025)).toBe(330);
    expect(standardOffsetMinutes('America/St_Johns', 2025)).toBe(-210);
    expect(standardOffsetMinutes('UTC', 2025)).toBe(0);
  });

  it('throws on a zone that does not exist', () => {
    expect(() => standardOffsetMinutes('Mars/Olympus_Mons')).toThrow(RangeError);
  });

  it('puts each offset from −12 h to +14 h into exactly one band', () => {
    for (let m = -720; m <= 840; m += 15) expect(bandOfOffset(m)).not.toBeNull();
    expect(bandOfOffset(-360)).toBe('americas');
    expect(bandOfOffset(60)).toBe('europe-africa');
    expect(bandOfOffset(600)).toBe('asia-pacific');
  });
});
