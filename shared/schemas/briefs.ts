// A songwriter's brief: one zod schema validates the form in the browser and the request on the server,
// so a mistake comes back as a message beside its field either way.
import { z } from 'zod';
import { DRUM_STYLES } from './profiles';
import { isSupportedCurrency, MAX_PROCESSOR_AMOUNT, SUPPORTED_CURRENCIES } from '../money/currency';

export const BRIEF_STATUSES = ['draft', 'open', 'hired', 'closed', 'withdrawn'] as const;
export type BriefStatus = (typeof BRIEF_STATUSES)[number];

export const SAMPLE_RATES = [44100, 48000, 88200, 96000] as const;
export const BIT_DEPTHS = ['24', '32f'] as const;
export const STEM_MODES = ['every_mic', 'named'] as const;
export const TIME_SIGNATURES = ['4/4', '3/4', '6/8', '12/8', '2/4', '5/4', '7/8', '7/4', '9/8'] as const;

export const TEMPO_LIMITS = { min: 20, max: 300 } as const;
/** Integer minor units, at most 8 digits (the payment processor's limit, REFERENCES.md). */
export const MAX_AMOUNT_MINOR = MAX_PROCESSOR_AMOUNT;
export const OPEN_BRIEFS_PAGE_SIZE = 20;
/** Guide tracks are demos with a click: a few minutes of WAV or MP3. */
export const GUIDE_MAX_BYTES = 60 * 1024 * 1024;

export const BIT_DEPTH_LABELS: Record<(typeof BIT_DEPTHS)[number], string> = { '24': '24-bit', '32f': '32-bit float' };
export const STEM_MODE_LABELS: Record<(typeof STEM_MODES)[number], string> = {
  every_mic: 'Every mic as its own stem',
  named: 'A named list of stems',
};

const DATE = /^\d{4}-\d{2}-\d{2}$/;

export function isCalendarDate(value: string): boolean {
  if (!DATE.test(value)) return false;
  const [y, m, d] = value.split('-').map(Number);
  const date = new Date(Date.UTC(y, m - 1, d));
  return date.getUTCFullYear() === y && date.getUTCMonth() === m - 1 && date.getUTCDate() === d;
}

/** Today's calendar date (YYYY-MM-DD) as seen in `timeZone`; en-CA formats dates that way. */
export function todayIn(timeZone: string, now: Date = new Date()): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
}

/** A calendar date `days` later (or earlier, when negative); calendar arithmetic in UTC, so no clock change shifts it. */
export function addDays(date: string, days: number): string {
  const [y, m, d] = date.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

/** A new brief's suggested deadline: four weeks, room for quotes, a session and a round of changes. */
export const DEFAULT_DEADLINE_DAYS = 28;

/** "3:45" → 225; null when it is not minutes:seconds with seconds below 60. */
export function parseMinutesSeconds(value: string): number | null {
  const m = /^\s*(\d{1,3}):([0-5]\d)\s*$/.exec(value);
  if (!m) return null;
  return Number(m[1]) * 60 + Number(m[2]);
}

export function formatMinutesSeconds(totalSeconds: number): string {
  const s = Math.round(totalSeconds);
  return `${Math.floor(s / 60)}:${String(s % 60).padStart(2, '0')}`;
}

export const currencySchema = z
  .string()
  .trim()
  .toUpperCase()
  .refine(isSupportedCurrency, `Pick one of ${SUPPORTED_CURRENCIES.join(', ')}`);

export const amountMinorSchema = z
  .number({ error: 'Enter an amount' })
  .int('Amounts are whole minor units')
  .min(0, 'Amounts cannot be negative')
  .max(MAX_AMOUNT_MINOR, 'That amount is too large');

export const calendarDateSchema = z.string().refine(isCalendarDate, 'Use a date like 2030-05-31');

const text = (max: number) => z.string().trim().max(max, `Use at most ${max} characters`);

const briefFieldsSchema = z.strictObject({
  songTitle: z.string().trim().min(1, 'Give the song a title').max(120, 'Use at most 120 characters'),
  description: text(4000).default(''),
  drumNotes: text(4000).default(''),
  // The same style list drummers pick from, so a brief's style matches their profiles and the search.
  style: z.enum(DRUM_STYLES, 'Pick a style from the list'),
  tempoBpm: z
    .number({ error: 'Enter the tempo in BPM' })
    .min(TEMPO_LIMITS.min, `Tempo is at least ${TEMPO_LIMITS.min} BPM`)
    .max(TEMPO_LIMITS.max, `Tempo is at most ${TEMPO_LIMITS.max} BPM`),
  timeSignature: z.enum(TIME_SIGNATURES, 'Pick a time signature from the list').default('4/4'),
  musicalKey: text(24).default(''),
  lengthBars: z.number().int('Bars are a whole number').min(1, 'At least 1 bar').max(2000, 'At most 2000 bars').nullable().default(null),
  lengthSeconds: z.number().int().min(5, 'At least 0:05').max(60 * 60, 'At most 60:00').nullable().default(null),
  songCount: z.number().int('A whole number of songs').min(1, 'At least one song').max(20, 'At most 20 songs').default(1),
  referenceNotes: text(4000).default(''),
  sampleRate: z.literal(SAMPLE_RATES, 'Pick 44.1, 48, 88.2 or 96 kHz'),
  bitDepth: z.enum(BIT_DEPTHS, 'Pick 24-bit or 32-bit float'),
  stemMode: z.enum(STEM_MODES, 'Pick how the stems are split'),
  stemList: z.array(z.string().trim().min(1, 'Name each stem').max(60)).max(64, 'At most 64 stems').default([]),
  roughMix: z.boolean().default(false),
  budgetMinMinor: amountMinorSchema,
  budgetMaxMinor: amountMinorSchema,
  currency: currencySchema,
  deadline: calendarDateSchema,
  needsRoom: z.boolean().default(false),
});

type BriefFields = z.infer<typeof briefFieldsSchema>;

// Cross-field rules, reported on the field the person should change.
function briefCrossChecks(value: BriefFields, ctx: z.RefinementCtx): void {
  if (value.budgetMinMinor > value.budgetMaxMinor) {
    ctx.addIssue({ code: 'custom', path: ['budgetMaxMinor'], message: 'The most you pay cannot be below the least' });
  }
  if ((value.lengthBars == null) === (value.lengthSeconds == null)) {
    ctx.addIssue({ code: 'custom', path: ['lengthBars'], message: 'Give the length either in bars or as minutes:seconds' });
  }
  if (value.stemMode === 'named' && value.stemList.length === 0) {
    ctx.addIssue({ code: 'custom', path: ['stemList'], message: 'List the stems you want, or choose every mic as its own stem' });
  }
}

export const briefInputSchema = briefFieldsSchema.superRefine(briefCrossChecks);
export type BriefInput = z.input<typeof briefInputSchema>;
export type BriefValues = z.output<typeof briefInputSchema>;

export const inviteInputSchema = z.strictObject({
  drummerIds: z.array(z.string().trim().min(1).max(64)).min(1, 'Pick at least one drummer').max(20, 'Invite at most 20 drummers at once'),
});
export type InviteInput = z.infer<typeof inviteInputSchema>;

const optionalNumber = (schema: z.ZodNumber) =>
  z.preprocess((v) => (v === '' || v === undefined ? undefined : Number(v)), schema.optional());

export const openBriefsQuerySchema = z.strictObject({
  style: z.preprocess((v) => (v === '' ? undefined : v), z.enum(DRUM_STYLES, 'Pick a style from the list').optional()),
  budgetMin: optionalNumber(z.number({ error: 'Use a whole amount' }).int().min(0).max(MAX_AMOUNT_MINOR)),
  // budgetMin is in this currency's minor units; minor units of two currencies cannot be compared.
  currency: z.preprocess((v) => (v === '' ? undefined : v), currencySchema.optional()),
  deadlineBefore: z.preprocess((v) => (v === '' ? undefined : v), calendarDateSchema.optional()),
  tempoMin: optionalNumber(z.number({ error: 'Use a number' }).min(0).max(1000)),
  tempoMax: optionalNumber(z.number({ error: 'Use a number' }).min(0).max(1000)),
  page: optionalNumber(z.number({ error: 'Use a page number' }).int().min(1).max(10_000)),
});
export type OpenBriefsQuery = z.infer<typeof openBriefsQuerySchema>;

/** What the API returns for one brief. */
export type BriefView = {
  id: string;
  songwriterId: string;
  songwriterName: string;
  status: BriefStatus;
  songTitle: string;
  description: string;
  drumNotes: string;
  style: string;
  tempoBpm: number;
  timeSignature: string;
  musicalKey: string;
  lengthBars: number | null;
  lengthSeconds: number | null;
  songCount: number;
  referenceNotes: string;
  sampleRate: number;
  bitDepth: '24' | '32f';
  stemMode: 'every_mic' | 'named';
  stemList: string[];
  roughMix: boolean;
  budgetMinMinor: number;
  budgetMaxMinor: number;
  currency: string;
  deadline: string;
  timeZone: string;
  needsRoom: boolean;
  guide: { name: string; mime: string; durationSec: number | null; hasPeaks: boolean } | null;
  publishedAt: string | null;
  createdAt: string;
  updatedAt: string;
  /** What the reader may do / already did. */
  viewer: { isOwner: boolean; invited: boolean; myQuoteId: string | null; quoteCount: number | null };
  /** Only for the owner. */
  invitedDrummers?: { id: string; displayName: string }[];
};

export type BriefListItem = Pick<
  BriefView,
  'id' | 'status' | 'songTitle' | 'style' | 'tempoBpm' | 'timeSignature' | 'budgetMinMinor' | 'budgetMaxMinor' | 'currency' | 'deadline' | 'songCount' | 'needsRoom' | 'publishedAt' | 'songwriterName'
> & { invited: boolean; myQuoteId: string | null; quoteCount: number | null; hasGuide: boolean };

export type BriefList = { items: BriefListItem[]; total: number; page: number; pageSize: number };
