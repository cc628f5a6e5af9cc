// Permissible daily noise exposure for the hearing-safety panel on rooms and bookings.
//
// Sources (as summarised in REFERENCES.md, from memory):
// - NIOSH recommended exposure limit, "Criteria for a Recommended Standard: Occupational Noise Exposure",
//   DHHS (NIOSH) Publication No. 98-126 (1998): 85 dBA for 8 h, 3 dB exchange rate,
//   T = 8 h / 2^((L − 85)/3) → 94 dBA: 1 h, 100 dBA: 15 min.
// - OSHA permissible exposure limit, 29 CFR 1910.95 (Table G-16 and Appendix A): 90 dBA for 8 h,
//   5 dB exchange rate, T = 8 h / 2^((L − 90)/5) → 95 dBA: 4 h.
// These are workplace rules for a working day; Kitlane shows them as a caution, never as advice.

import { z } from 'zod';

export const NIOSH_REL = { criterionDbA: 85, exchangeDb: 3, source: 'NIOSH 98-126 (1998)' } as const;
export const OSHA_PEL = { criterionDbA: 90, exchangeDb: 5, source: 'OSHA 29 CFR 1910.95' } as const;

const WORKDAY_MINUTES = 8 * 60;

/** The panel accepts levels a sound level meter could plausibly show in a room; outside is a typing error. */
export const SOUND_LEVEL_LIMITS = { minDbA: 40, maxDbA: 150 } as const;

export const soundLevelInputSchema = z.object({
  levelDbA: z
    .number({ error: 'Enter a sound level in dBA' })
    .min(SOUND_LEVEL_LIMITS.minDbA, `A level below ${SOUND_LEVEL_LIMITS.minDbA} dBA is not a loud room`)
    .max(SOUND_LEVEL_LIMITS.maxDbA, `A level above ${SOUND_LEVEL_LIMITS.maxDbA} dBA is not plausible here`),
});
export type SoundLevelInput = z.infer<typeof soundLevelInputSchema>;

export interface PermissibleExposure {
  levelDbA: number;
  /** Minutes per day under the NIOSH REL. Above 480 means the level is below the 85 dBA criterion. */
  nioshMinutes: number;
  /** Minutes per day under the OSHA PEL. Above 480 means the level is below the 90 dBA criterion. */
  oshaMinutes: number;
}

/** Minutes per day at a constant level under one criterion/exchange-rate rule: 480 / 2^((L − criterion)/exchange). */
export function allowedMinutes(levelDbA: number, rule: { criterionDbA: number; exchangeDb: number }): number {
  if (!Number.isFinite(levelDbA)) throw new RangeError(`sound level must be a finite number, got ${levelDbA}`);
  return WORKDAY_MINUTES / 2 ** ((levelDbA - rule.criterionDbA) / rule.exchangeDb);
}

export function permissibleExposure(levelDbA: number): PermissibleExposure {
  return {
    levelDbA,
    nioshMinutes: allowedMinutes(levelDbA, NIOSH_REL),
    oshaMinutes: allowedMinutes(levelDbA, OSHA_PEL),
  };
}

export interface ExposurePeriod {
  levelDbA: number;
  minutes: number;
}

/**
 * Daily noise dose in percent, D = 100 · Σ Cᵢ/Tᵢ (time at each level over the time allowed at it),
 * the way both documents combine periods at different levels; 100 % is the whole day's allowance.
 */
export function dailyDosePercent(periods: readonly ExposurePeriod[]): { niosh: number; osha: number } {
  let niosh = 0;
  let osha = 0;
  for (const p of periods) {
    if (!(Number.isFinite(p.minutes) && p.minutes >= 0)) throw new RangeError(`minutes must be ≥ 0, got ${p.minutes}`);
    niosh += p.minutes / allowedMinutes(p.levelDbA, NIOSH_REL);
    osha += p.minutes / allowedMinutes(p.levelDbA, OSHA_PEL);
  }
  return { niosh: niosh * 100, osha: osha * 100 };
}

/**
 * A duration for people: "8 h", "2 h 30 min", "15 min", "1 min 29 s", "9 s", "under 1 s".
 * Rounded to whole minutes from one hour up and to whole seconds below, which is as precise as
 * an exposure guideline deserves; more than a workday reads "more than 8 h".
 */
export function formatDuration(minutes: number): string {
  if (!(Number.isFinite(minutes) && minutes >= 0)) throw new RangeError(`minutes must be ≥ 0, got ${minutes}`);
  if (minutes > WORKDAY_MINUTES + 0.5) return 'more than 8 h';
  if (minutes >= 59.5) {
    const whole = Math.round(minutes);
    const h = Math.floor(whole / 60);
    const m = whole % 60;
    return m === 0 ? `${h} h` : `${h} h ${m} min`;
  }
  const seconds = Math.round(minutes * 60);
  if (seconds < 1) return 'under 1 s';
  const m = Math.floor(seconds / 60);
  const s = seconds % 60;
  if (m === 0) return `${s} s`;
  return s === 0 ? `${m} min` : `${m} min ${s} s`;
}

/** Levels a person can pick instead of typing; each is a criterion or a stated common-practice figure. */
export const SOUND_LEVEL_PRESETS: readonly { levelDbA: number; label: string; basis: string }[] = [
  { levelDbA: 85, label: 'NIOSH criterion level (8 h)', basis: NIOSH_REL.source },
  { levelDbA: 90, label: 'OSHA criterion level (8 h)', basis: OSHA_PEL.source },
  { levelDbA: 100, label: "Drum kit at the player's seat (commonly above this)", basis: 'common practice' },
];

export const SAFETY_CAUTIONS = {
  drums:
    "A drum kit at the player's seat is commonly above 100 dBA (common practice). At that level the NIOSH recommendation allows about 15 minutes a day without hearing protection.",
  protection: 'Keep hearing protection at hand for the drummer and anyone in the room while the kit is played.',
  authority:
    'These figures come from published occupational guidance (NIOSH 98-126, OSHA 29 CFR 1910.95) and are shown as a caution only. Local rules and a qualified professional decide what is safe for you.',
} as const;

/** One sentence for the panel: what the two limits allow at this level. */
export function exposureSummary(levelDbA: number): string {
  const e = permissibleExposure(levelDbA);
  return `At ${formatLevel(levelDbA)} dBA: ${formatDuration(e.nioshMinutes)} a day under the NIOSH recommendation, ${formatDuration(e.oshaMinutes)} under the OSHA limit.`;
}

function formatLevel(levelDbA: number): string {
  return Number.isInteger(levelDbA) ? String(levelDbA) : levelDbA.toFixed(1);
}
