// Creating and updating rooms: the same zod schema validates the engineer's form in the browser and the
// request on the server, so every mistake comes back as a field error beside the field.
// The geometry (dimensions, surfaces, panels, openings) feeds computeAcoustics via toRoomGeometry.

import { z } from 'zod';
import { MATERIAL_IDS, OCTAVE_BANDS_HZ } from '../acoustics/materials';
import {
  feetToMetres,
  metresToFeet,
  roomGeometryCrossIssues,
  roomGeometryFieldIssues,
  SURFACE_IDS,
  type RoomGeometry,
} from '../acoustics/room-acoustics';
import { TZ_BAND_IDS, type TzBand } from './profiles';

/** Sane bounds for a room a drum kit is recorded in, metres: anything outside is a typing or unit mistake. */
export const ROOM_DIMENSION_LIMITS_M = {
  length: { min: 1.5, max: 60 },
  width: { min: 1.5, max: 60 },
  height: { min: 1.8, max: 25 },
} as const;

export const ROOM_INPUT_LIMITS = { min: 1, max: 256 } as const;

/** Integer minor units, at most 8 digits (the payment processor's limit, REFERENCES.md). */
export const MAX_AMOUNT_MINOR = 99_999_999;

const COEFFICIENT_MESSAGE = 'Absorption coefficients are between 0 and 1';

const coefficientSchema = z.number({ error: COEFFICIENT_MESSAGE }).min(0, COEFFICIENT_MESSAGE).max(1, COEFFICIENT_MESSAGE);

/** Six coefficients, one per octave band 125 Hz–4 kHz. */
export const coefficientsInputSchema = z.tuple(
  [coefficientSchema, coefficientSchema, coefficientSchema, coefficientSchema, coefficientSchema, coefficientSchema],
  { error: `Give ${OCTAVE_BANDS_HZ.length} coefficients, one per octave band 125 Hz–4 kHz` },
);

const materialFinishSchema = z.object({
  kind: z.literal('material'),
  materialId: z.enum(MATERIAL_IDS, { error: 'Choose a material from the list' }),
});
const customFinishSchema = z.object({
  kind: z.literal('custom'),
  coefficients: coefficientsInputSchema,
  label: z.string().trim().max(80).optional(),
});

export const surfaceFinishInputSchema = z.discriminatedUnion('kind', [materialFinishSchema, customFinishSchema], {
  error: 'Choose a material or enter custom coefficients',
});
export const openingFinishInputSchema = z.discriminatedUnion('kind', [materialFinishSchema, customFinishSchema, z.object({ kind: z.literal('open') })], {
  error: 'Choose a material, custom coefficients or open',
});

const surfaceIdSchema = z.enum(SURFACE_IDS, { error: 'Choose the surface it sits on' });
const areaSchema = z
  .number({ error: 'Enter the area in square metres' })
  .positive('The area must be more than 0 m²')
  .max(ROOM_DIMENSION_LIMITS_M.length.max * ROOM_DIMENSION_LIMITS_M.width.max, 'The area is larger than any room surface');

export const panelInputSchema = z.object({ surface: surfaceIdSchema, areaM2: areaSchema, finish: surfaceFinishInputSchema });
export const openingInputSchema = z.object({
  type: z.enum(['door', 'window'], { error: 'Choose door or window' }),
  surface: surfaceIdSchema,
  areaM2: areaSchema,
  finish: openingFinishInputSchema,
});

export const surfacesInputSchema = z.object(
  Object.fromEntries(SURFACE_IDS.map((s) => [s, surfaceFinishInputSchema])) as Record<(typeof SURFACE_IDS)[number], typeof surfaceFinishInputSchema>,
);

const dimensionSchema = z.number({ error: 'Enter a number' }).refine(Number.isFinite, 'Enter a number');

/** Dimensions in the unit the engineer typed; bounds are checked after converting feet to metres. */
export const dimensionsInputSchema = z
  .object({ unit: z.enum(['m', 'ft'], { error: 'Choose metres or feet' }), length: dimensionSchema, width: dimensionSchema, height: dimensionSchema })
  .superRefine((d, ctx) => {
    for (const field of ['length', 'width', 'height'] as const) {
      const metres = d.unit === 'ft' ? feetToMetres(d[field]) : d[field];
      const { min, max } = ROOM_DIMENSION_LIMITS_M[field];
      if (!(metres >= min && metres <= max)) ctx.addIssue({ code: 'custom', path: [field], message: boundsMessage(field, d.unit) });
    }
  });

const currencySchema = z.string().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code such as EUR');
const amountMinorSchema = z
  .number({ error: 'Enter an amount' })
  .int('Amounts are whole numbers of the smallest currency unit')
  .min(0, 'The amount cannot be negative')
  .max(MAX_AMOUNT_MINOR, 'The amount is too large');

export const timeZoneSchema = z
  .string()
  .trim()
  .refine(isIanaTimeZone, 'Use an IANA time zone name (Area/Location, or UTC)');

const roomFields = {
  name: z.string().trim().min(1, 'Give the room a name').max(120, 'Keep the name under 120 characters'),
  town: z.string().trim().min(1, 'Say which town the room is in').max(120, 'Keep the town under 120 characters'),
  timeZone: timeZoneSchema,
  description: z.string().trim().max(5000, 'Keep the description under 5000 characters'),
  dayRateMinor: amountMinorSchema,
  halfDayRateMinor: amountMinorSchema,
  currency: currencySchema,
  inputs: z
    .number({ error: 'Enter the number of inputs' })
    .int('Inputs are a whole number')
    .min(ROOM_INPUT_LIMITS.min, `At least ${ROOM_INPUT_LIMITS.min} input`)
    .max(ROOM_INPUT_LIMITS.max, `At most ${ROOM_INPUT_LIMITS.max} inputs`),
  dimensions: dimensionsInputSchema,
  surfaces: surfacesInputSchema,
  panels: z.array(panelInputSchema).max(100, 'At most 100 panels'),
  openings: z.array(openingInputSchema).max(50, 'At most 50 openings'),
};

const roomObjectSchema = z.object(roomFields);
type RoomObject = z.infer<typeof roomObjectSchema>;

export const roomInputSchema = roomObjectSchema.superRefine((room, ctx) => {
  addRateIssues(room, ctx);
  addGeometryIssues(room, ctx);
});
export type RoomInput = z.infer<typeof roomInputSchema>;

/**
 * A partial update. Cross-field rules are checked here only when the fields involved are all present;
 * the service merges the update into the stored room and parses the result with roomInputSchema.
 */
export const roomUpdateInputSchema = z
  .object(roomFields)
  .partial()
  .superRefine((room, ctx) => {
    if (room.dayRateMinor !== undefined && room.halfDayRateMinor !== undefined) addRateIssues(room as Pick<RoomObject, 'dayRateMinor' | 'halfDayRateMinor'>, ctx);
    if (room.dimensions && room.surfaces && room.panels && room.openings) addGeometryIssues(room as RoomObject, ctx);
  });
export type RoomUpdateInput = z.infer<typeof roomUpdateInputSchema>;

/** The geometry computeAcoustics takes, in metres. */
export function toRoomGeometry(room: Pick<RoomObject, 'dimensions' | 'surfaces' | 'panels' | 'openings'>): RoomGeometry {
  const toM = (v: number) => (room.dimensions.unit === 'ft' ? feetToMetres(v) : v);
  return {
    dimensions: { lengthM: toM(room.dimensions.length), widthM: toM(room.dimensions.width), heightM: toM(room.dimensions.height) },
    surfaces: room.surfaces,
    panels: room.panels,
    openings: room.openings,
  };
}

export function isIanaTimeZone(value: string): boolean {
  // Intl also accepts some non-IANA spellings on some engines; the shape check keeps to Area/Location names and UTC.
  if (!/^(UTC|[A-Za-z]+(\/[A-Za-z0-9_+-]+)+)$/.test(value)) return false;
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: value });
    return true;
  } catch {
    return false;
  }
}

type IssueSink = { addIssue: (issue: { code: 'custom'; path: PropertyKey[]; message: string }) => void };

function addRateIssues(room: Pick<RoomObject, 'dayRateMinor' | 'halfDayRateMinor'>, ctx: IssueSink): void {
  if (room.halfDayRateMinor > room.dayRateMinor) {
    ctx.addIssue({ code: 'custom', path: ['halfDayRateMinor'], message: 'The half-day rate cannot be more than the day rate' });
  }
}

/** Panels/openings that overflow their surface and bands with no absorption, once every single field is valid. */
function addGeometryIssues(room: RoomObject, ctx: IssueSink): void {
  if (!dimensionsWithinBounds(room.dimensions)) return;
  const geometry = toRoomGeometry(room);
  if (roomGeometryFieldIssues(geometry).length > 0) return;
  for (const issue of roomGeometryCrossIssues(geometry)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
}

function dimensionsWithinBounds(d: RoomObject['dimensions']): boolean {
  return (['length', 'width', 'height'] as const).every((f) => {
    const metres = d.unit === 'ft' ? feetToMetres(d[f]) : d[f];
    return metres >= ROOM_DIMENSION_LIMITS_M[f].min && metres <= ROOM_DIMENSION_LIMITS_M[f].max;
  });
}

function boundsMessage(field: 'length' | 'width' | 'height', unit: 'm' | 'ft'): string {
  const { min, max } = ROOM_DIMENSION_LIMITS_M[field];
  const name = field[0].toUpperCase() + field.slice(1);
  if (unit === 'm') return `${name} must be between ${min} and ${max} m`;
  return `${name} must be between ${metresToFeet(min).toFixed(1)} and ${metresToFeet(max).toFixed(1)} ft`;
}

// Query strings are strings: an empty value means "no filter", so a search form can always send every key.
const emptyToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);
const optionalQuery = <T extends z.ZodType>(schema: T) => z.preprocess(emptyToUndefined, schema.optional());
const queryNumber = (min: number, max: number) =>
  z.coerce.number({ error: 'Enter a number' }).refine(Number.isFinite, 'Enter a number').pipe(z.number().min(min, `At least ${min}`).max(max, `At most ${max}`));

export const ROOM_SEARCH_PAGE_SIZE = 20;

/**
 * Filters for the public room search (`GET /api/rooms?q=&town=&tzBand=&minVolume=&rtMin=&rtMax=&maxDayRate=&minInputs=&page=`),
 * parsed from the query string (hence coerce). Size is the volume in m³; reverberation is the mid-band RT60
 * (500 Hz–1 kHz) by the recommended formula; the day rate is in the currency's major unit, as a person types it.
 */
export const roomSearchQuerySchema = z
  .object({
    // Long pasted text is cut, never refused: a search box should not answer with an error.
    q: optionalQuery(z.string().transform((s) => s.slice(0, 200).trim())),
    town: optionalQuery(z.string().transform((s) => s.slice(0, 120).trim())),
    tzBand: optionalQuery(z.enum(TZ_BAND_IDS as [TzBand, ...TzBand[]], { error: 'Pick a time zone band from the list' })),
    minVolume: optionalQuery(queryNumber(0, 100_000)),
    maxVolume: optionalQuery(queryNumber(0, 100_000)),
    rtMin: optionalQuery(queryNumber(0, 10)),
    rtMax: optionalQuery(queryNumber(0, 10)),
    maxDayRate: optionalQuery(queryNumber(0, 999_999)),
    currency: optionalQuery(currencySchema),
    minInputs: optionalQuery(queryNumber(ROOM_INPUT_LIMITS.min, ROOM_INPUT_LIMITS.max).pipe(z.number().int('Inputs are a whole number'))),
    page: z.preprocess(emptyToUndefined, z.coerce.number().int().min(1).max(500).default(1)),
    pageSize: z.preprocess(emptyToUndefined, z.coerce.number().int().min(1).max(50).default(ROOM_SEARCH_PAGE_SIZE)),
  })
  .superRefine((q, ctx) => {
    if (q.minVolume !== undefined && q.maxVolume !== undefined && q.minVolume > q.maxVolume) {
      ctx.addIssue({ code: 'custom', path: ['maxVolume'], message: 'The largest size is smaller than the smallest' });
    }
    if (q.rtMin !== undefined && q.rtMax !== undefined && q.rtMin > q.rtMax) {
      ctx.addIssue({ code: 'custom', path: ['rtMax'], message: 'The longest reverberation is shorter than the shortest' });
    }
    // Rates only compare within one currency (DESIGN.md, Money).
    if (q.maxDayRate !== undefined && q.currency === undefined) {
      ctx.addIssue({ code: 'custom', path: ['currency'], message: 'Pick the currency of the highest day rate' });
    }
  });
export type RoomSearchQuery = z.infer<typeof roomSearchQuerySchema>;

// ---- Calendar and photos ----

/** How far ahead an engineer can block dates; a longer calendar is a typing mistake. */
export const BLOCKED_DATES_MAX = 400;

const calendarDateSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-03-14')
  .refine((d) => {
    const [y, m, day] = d.split('-').map(Number);
    const date = new Date(Date.UTC(y, m - 1, day));
    return date.getUTCFullYear() === y && date.getUTCMonth() === m - 1 && date.getUTCDate() === day;
  }, 'That date does not exist');

/** The whole set of blocked dates (calendar dates in the room's time zone); the server replaces the stored set. */
export const blockedDatesInputSchema = z.object({
  dates: z
    .array(calendarDateSchema)
    .max(BLOCKED_DATES_MAX, `At most ${BLOCKED_DATES_MAX} blocked dates`)
    .transform((dates) => [...new Set(dates)].sort()),
});
export type BlockedDatesInput = z.infer<typeof blockedDatesInputSchema>;

export const ROOM_PHOTO_MAX_BYTES = 10 * 1024 * 1024;
export const ROOM_PHOTO_MAX_COUNT = 12;
/** Longest side of the stored photo and of its thumbnail, px (the server re-encodes both; the original is not kept). */
export const ROOM_PHOTO_SIZES = { large: 1600, thumb: 400 } as const;

export const roomPhotoFieldsInputSchema = z.object({
  caption: z.string().trim().max(200, 'Keep the caption under 200 characters').default(''),
});

// ---- Response shapes ----

export type RoomPhotoView = { id: string; caption: string; width: number; height: number; url: string; thumbUrl: string };

export type RoomSummary = {
  id: string;
  engineerId: string;
  engineerName: string;
  name: string;
  town: string;
  timeZone: string;
  dayRateMinor: number;
  halfDayRateMinor: number;
  currency: string;
  inputs: number;
  volumeM3: number;
  floorAreaM2: number;
  /** Mid-band (500 Hz–1 kHz) RT60 by the recommended formula, seconds. */
  midRt60Sec: number;
  reading: RoomReadingId;
  thumbUrl: string | null;
  packageCount: number;
  /** Removed by the engineer: out of search, still readable from the quotes and bookings that name it. */
  archived: boolean;
};

export type RoomReadingId = 'tight' | 'controlled' | 'lively' | 'very_live';

export type RoomView = RoomSummary &
  RoomInput & {
    photos: RoomPhotoView[];
    blockedDates: string[];
    /** The reader owns it and may edit. */
    mine: boolean;
    createdAt: string;
    updatedAt: string;
  };

export type RoomSearchResult = { items: RoomSummary[]; total: number };

/** `GET /api/rooms/:id/acoustics`: the fixed shape of DESIGN.md plus what the client needs to explain it. */
export type RoomAcousticsView = {
  bands: { hz: number; sabineSec: number; eyringSec: number; averageAbsorption: number }[];
  modes: { hz: number; axis: 'length' | 'width' | 'height'; order: number; coincidentWith: { hz: number; axis: 'length' | 'width' | 'height'; order: number }[] }[];
  schroederHz: number;
  reading: RoomReadingId;
  readingText: string;
  readingThresholds: { reading: RoomReadingId; belowSec: number | null }[];
  recommended: 'sabine' | 'eyring';
  recommendedReason: string;
  midBandRt60Sec: number;
  volumeM3: number;
  surfaceM2: number;
  speedOfSoundMs: number;
  notes: string[];
};
