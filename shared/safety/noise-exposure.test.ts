import { describe, expect, it } from 'vitest';
import {
  allowedMinutes,
  dailyDosePercent,
  exposureSummary,
  formatDuration,
  NIOSH_REL,
  OSHA_PEL,
  permissibleExposure,
  SAFETY_CAUTIONS,
  soundLevelInputSchema,
} from './noise-exposure';

describe('permissibleExposure', () => {
  it('allows a full 8 h day at each criterion level', () => {
    expect(permissibleExposure(85).nioshMinutes).toBeCloseTo(480, 10);
    expect(permissibleExposure(90).oshaMinutes).toBeCloseTo(480, 10);
  });

  it('halves the time for every exchange-rate step', () => {
    expect(allowedMinutes(88, NIOSH_REL)).toBeCloseTo(240, 10);
    expect(allowedMinutes(91, NIOSH_REL)).toBeCloseTo(120, 10);
    expect(allowedMinutes(100, OSHA_PEL)).toBeCloseTo(120, 10);
  });

  it('gives more than a workday below the criterion', () => {
    expect(permissibleExposure(80).nioshMinutes).toBeGreaterThan(480);
  });

  it('refuses a level that is not a number', () => {
    expect(() => permissibleExposure(Number.NaN)).toThrow(RangeError);
  });
});

describe('dailyDosePercent', () => {
  it('adds the fractions of the allowance used at each level', () => {
    // NIOSH: 30 min at 100 dBA (15 min allowed) = 200 %, plus 4 h at 85 dBA = 50 %.
    const dose = dailyDosePercent([
      { levelDbA: 100, minutes: 30 },
      { levelDbA: 85, minutes: 240 },
    ]);
    expect(dose.niosh).toBeCloseTo(250, 8);
    // OSHA: 30 min at 100 dBA (120 min allowed) = 25 %, 240 min at 85 dBA (960 min allowed) = 25 %.
    expect(dose.osha).toBeCloseTo(50, 8);
  });
});

describe('formatDuration', () => {
  it('writes hours and minutes the way people say them', () => {
    expect(formatDuration(480)).toBe('8 h');
    expect(formatDuration(150)).toBe('2 h 30 min');
    expect(formatDuration(60)).toBe('1 h');
    expect(formatDuration(15)).toBe('15 min');
    expect(formatDuration(480 / 2 ** (25 / 3))).toBe('1 min 29 s');
    expect(formatDuration(0.15)).toBe('9 s');
    expect(formatDuration(0.001)).toBe('under 1 s');
    expect(formatDuration(960)).toBe('more than 8 h');
  });

  it('refuses a negative duration', () => {
    expect(() => formatDuration(-1)).toThrow(RangeError);
  });
});

describe('exposure texts', () => {
  it('summarises both limits for a level', () => {
    expect(exposureSummary(100)).toBe('At 100 dBA: 15 min a day under the NIOSH recommendation, 2 h under the OSHA limit.');
  });

  it('says local rules and a qualified professional decide', () => {
    expect(SAFETY_CAUTIONS.authority).toMatch(/local rules and a qualified professional decide/i);
    expect(SAFETY_CAUTIONS.drums).toContain('100 dBA');
  });
});

describe('soundLevelInputSchema', () => {
  it('accepts a plausible level and gives a field error for an absurd one', () => {
    expect(soundLevelInputSchema.parse({ levelDbA: 104 })).toEqual({ levelDbA: 104 });
    const bad = soundLevelInputSchema.safeParse({ levelDbA: 400 });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].path).toEqual(['levelDbA']);
  });
});
