import { z } from 'zod';
import { SUPPORTED_CURRENCIES, minorUnitExponent, type CurrencyCode } from '../money/currency';

// Drummer and engineer profiles, and the public drummer search. Used by the server (validation) and
// by the client (forms with zodResolver, URL filters), so every rule lives here once.

/** The fixed style list a drummer picks from; free tags cover the rest. Ids are URL-safe. */
export const DRUM_STYLES = [
  'rock',
  'pop',
  'funk',
  'soul',
  'jazz',
  'metal',
  'punk',
  'indie',
  'country',
  'folk',
  'hip-hop',
  'r-and-b',
  'latin',
  'reggae',
  'gospel',
  'electronic',
  'singer-songwriter',
  'blues',
  'fusion',
  'world',
] as const;
export type DrumStyle = (typeof DRUM_STYLES)[number];

export const DRUM_STYLE_LABELS: Record<DrumStyle, string> = {
  rock: 'Rock',
  pop: 'Pop',
  funk: 'Funk',
  soul: 'Soul',
  jazz: 'Jazz',
  metal: 'Metal',
  punk: 'Punk',
  indie: 'Indie',
  country: 'Country',
  folk: 'Folk',
  'hip-hop': 'Hip-hop',
  'r-and-b': 'R&B',
  latin: 'Latin',
  reggae: 'Reggae',
  gospel: 'Gospel',
  electronic: 'Electronic',
  'singer-songwriter': 'Singer-songwriter',
  blues: 'Blues',
  fusion: 'Fusion',
  world: 'World',
};

export function styleLabel(id: string): string {
  return (DRUM_STYLE_LABELS as Record<string, string>)[id] ?? id;
}

/** What an engineer can offer besides rooms and mic packages (those come with the rooms issue). */
export const ENGINEER_SERVICES = [
  'tracking',
  'drum-editing',
  'mixing',
  'stem-prep',
  'reamping',
  'remote-sessions',
  'room-hire',
] as const;
export type EngineerService = (typeof ENGINEER_SERVICES)[number];

export const ENGINEER_SERVICE_LABELS: Record<EngineerService, string> = {
  tracking: 'Drum tracking',
  'drum-editing': 'Drum editing and timing',
  mixing: 'Drum mixing',
  'stem-prep': 'Stem preparation for delivery',
  reamping: 'Re-amping and room re-recording',
  'remote-sessions': 'Remote sessions (songwriter listens in)',
  'room-hire': 'Room hire',
};

/** Currencies a rate may be quoted in: the platform's supported list (shared/money). */
export const RATE_CURRENCIES = SUPPORTED_CURRENCIES;
export type RateCurrency = CurrencyCode;

/**
 * A search's "rate at most" as typed (e.g. 250.5, major units) → integer minor units of that currency.
 * Rounded down: a filter limit, unlike a price, may be cut to the currency's precision.
 */
export function maxRateToMinor(amount: number, currency: string): number {
  return Math.floor(amount * 10 ** minorUnitExponent(currency) + 1e-9);
}
/** The same conversion under its first name (the rooms search uses it for its day-rate limit). */
export const majorToMinor = maxRateToMinor;

export function isValidTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

export const timeZoneSchema = z
  .string()
  .trim()
  .min(1, 'Pick a time zone')
  .max(64)
  .refine(isValidTimeZone, 'Pick a time zone from the list (an IANA name such as Europe/Berlin)');

const shortText = (max: number, what: string) => z.string().trim().max(max, `Keep the ${what} under ${max} characters`);

const tagSchema = z
  .string()
  .trim()
  .toLowerCase()
  .min(2, 'A tag needs at least 2 characters')
  .max(30, 'Keep each tag under 30 characters')
  .regex(/^[\p{L}\p{N}][\p{L}\p{N} &'+-]*$/u, 'Use letters, numbers, spaces and - & + in tags');

export const drummerProfileInputSchema = z.strictObject({
  headline: shortText(120, 'headline'),
  bio: shortText(4000, 'bio'),
  styles: z
    .array(z.enum(DRUM_STYLES, 'Pick styles from the list'))
    .max(8, 'Pick at most 8 styles')
    .transform((s) => [...new Set(s)]),
  tags: z
    .array(tagSchema)
    .max(12, 'Use at most 12 tags')
    .transform((t) => [...new Set(t)]),
  kit: shortText(2000, 'kit description'),
  baseRateMinor: z
    .number('Enter your rate per song')
    .int('Rates are whole minor units')
    .min(0, 'A rate cannot be negative')
    .max(99_999_999, 'That rate is higher than we can take'),
  currency: z.enum(RATE_CURRENCIES, 'Pick a currency from the list'),
  turnaroundDays: z.number('Enter your usual turnaround').int().min(1, 'At least 1 day').max(90, 'At most 90 days'),
  revisionsIncluded: z.number('Enter the revisions included').int().min(0).max(10, 'At most 10 revisions'),
  takingWork: z.boolean(),
  town: shortText(80, 'town'),
  country: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^([A-Z]{2})?$/, 'Use the two-letter country code (e.g. DE)'),
  timeZone: timeZoneSchema,
  published: z.boolean(),
});
export type DrummerProfileInput = z.infer<typeof drummerProfileInputSchema>;
export type DrummerProfileFormValues = z.input<typeof drummerProfileInputSchema>;

export const engineerProfileInputSchema = z.strictObject({
  headline: shortText(120, 'headline'),
  bio: shortText(4000, 'bio'),
  services: z
    .array(z.enum(ENGINEER_SERVICES, 'Pick services from the list'))
    .max(ENGINEER_SERVICES.length)
    .transform((s) => [...new Set(s)]),
  town: shortText(80, 'town'),
  country: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^([A-Z]{2})?$/, 'Use the two-letter country code (e.g. DE)'),
  timeZone: timeZoneSchema,
});
export type EngineerProfileInput = z.infer<typeof engineerProfileInputSchema>;
export type EngineerProfileFormValues = z.input<typeof engineerProfileInputSchema>;

// ---- Time zone bands (working-hours neighbourhoods for the search filter) ----

/** Inclusive ranges of the zone's standard-time UTC offset, in minutes; together they cover −12 h…+14 h without gaps. */
export const TZ_BANDS = {
  americas: { label: 'Americas (UTC−12 to −2)', minMinutes: -720, maxMinutes: -61 },
  'europe-africa': { label: 'Europe & Africa (UTC−1 to +3:30)', minMinutes: -60, maxMinutes: 239 },
  'asia-pacific': { label: 'Asia & Pacific (UTC+4 to +14)', minMinutes: 240, maxMinutes: 840 },
} as const;
export type TzBand = keyof typeof TZ_BANDS;
export const TZ_BAND_IDS = Object.keys(TZ_BANDS) as TzBand[];

export function bandOfOffset(minutes: number): TzBand | null {
  for (const id of TZ_BAND_IDS) {
    const b = TZ_BANDS[id];
    if (minutes >= b.minMinutes && minutes <= b.maxMinutes) return id;
  }
  return null;
}

// ---- Search ----

export const SEARCH_SORTS = ['best', 'rate', 'turnaround', 'rating'] as const;
export type SearchSort = (typeof SEARCH_SORTS)[number];
export const SEARCH_PAGE_SIZE = 20;

// Query strings are strings: empty values mean "no filter", so a form can always send every key.
const emptyToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);
const optional = <T extends z.ZodType>(schema: T) => z.preprocess(emptyToUndefined, schema.optional());

export const drummerSearchQuerySchema = z
  .object({
    // Long pasted text is cut, never refused: a search box should not answer with an error.
    q: optional(z.string().transform((s) => s.slice(0, 200).trim())),
    style: optional(z.enum(DRUM_STYLES, 'Pick a style from the list')),
    /** In the currency's major unit (what a person types: 300 = 300.00). */
    maxRate: optional(z.coerce.number('Enter a number').min(0, 'A rate cannot be negative').max(999_999)),
    currency: optional(z.enum(RATE_CURRENCIES, 'Pick a currency from the list')),
    maxTurnaround: optional(z.coerce.number('Enter a number of days').int('Whole days').min(1).max(365)),
    takingWork: optional(z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1')),
    tzBand: optional(z.enum(TZ_BAND_IDS as [TzBand, ...TzBand[]], 'Pick a time zone band from the list')),
    sort: z.preprocess(emptyToUndefined, z.enum(SEARCH_SORTS, 'Sort by best, rate, turnaround or rating').default('best')),
    page: z.preprocess(emptyToUndefined, z.coerce.number().int().min(1).max(500).default(1)),
    pageSize: z.preprocess(emptyToUndefined, z.coerce.number().int().min(1).max(50).default(SEARCH_PAGE_SIZE)),
  })
  .refine((v) => v.maxRate === undefined || v.currency !== undefined, {
    message: 'Pick the currency of the maximum rate',
    path: ['currency'],
  });
export type DrummerSearchQuery = z.infer<typeof drummerSearchQuerySchema>;

export type DrummerSearchItem = {
  id: string;
  displayName: string;
  headline: string;
  styles: string[];
  baseRateMinor: number;
  currency: string;
  turnaroundDays: number;
  takingWork: boolean;
  town: string;
  country: string;
  timeZone: string;
  ratingAvg: number | null;
  ratingCount: number;
  reelTrackId?: string;
};
export type DrummerSearchResult = { items: DrummerSearchItem[]; total: number };

// ---- Response shapes ----

export type ReelTrackSummary = {
  id: string;
  title: string;
  style: string;
  tempoBpm: number | null;
  mime: string;
  sizeBytes: number;
  durationSec: number | null;
  hasPeaks: boolean;
  position: number;
};

export type DrummerProfile = DrummerProfileInput & {
  userId: string;
  displayName: string;
  utcOffsetMinutes: number;
  ratingAvg: number | null;
  ratingCount: number;
  /** Shown in search and on the public page: published and with a headline. */
  listed: boolean;
  updatedAt: string | null;
};

export type OwnDrummerProfile = { profile: DrummerProfile; reelTracks: ReelTrackSummary[] };

export type PublicDrummer = Omit<DrummerProfile, 'published' | 'listed' | 'updatedAt'> & {
  id: string;
  isEngineer: boolean;
  reelTracks: ReelTrackSummary[];
};

export type EngineerProfile = EngineerProfileInput & {
  userId: string;
  displayName: string;
  listed: boolean;
  updatedAt: string | null;
};

export type PublicEngineer = Omit<EngineerProfile, 'listed' | 'updatedAt'> & {
  id: string;
  isDrummer: boolean;
  /** Rooms and mic packages arrive with the rooms issue; the page keeps their place. */
  rooms: unknown[];
};
