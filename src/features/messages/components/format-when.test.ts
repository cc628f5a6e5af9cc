import { describe, expect, it } from 'vitest';
import { formatBytes, formatWhen } from './format-when';

describe('formatWhen', () => {
  const now = new Date(2031, 4, 10, 15, 0);
  it('shows only the time for a message of today', () => {
    const text = formatWhen(new Date(2031, 4, 10, 9, 5).toISOString(), now, 'en-GB');
    expect(text).toBe('9:05');
  });

  it('adds the day for an earlier day of this year, and the year before that', () => {
    expect(formatWhen(new Date(2031, 1, 3, 9, 5).toISOString(), now, 'en-GB')).toMatch(/^3 Feb(,| at)? 9:05$/);
    expect(formatWhen(new Date(2029, 1, 3, 9, 5).toISOString(), now, 'en-GB')).toMatch(/2029/);
  });
});

describe('formatBytes', () => {
  it('uses B, KB and MB', () => {
    expect(formatBytes(900)).toBe('900 B');
    expect(formatBytes(820 * 1024)).toBe('820 KB');
    expect(formatBytes(4.2 * 1024 * 1024)).toBe('4.2 MB');
  });
});
