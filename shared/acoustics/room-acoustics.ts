// The room estimate Kitlane shows engineers and songwriters: reverberation time per octave band
// (Sabine and Eyring), the first axial modes with coincidences flagged, the Schroeder frequency and a
// plain-words reading for drums. Pure: no I/O, so the server, the client and the tests share it.
//
// Model (a rectangular box, the usual first estimate): six surfaces, each with one finish. Treatment
// panels and openings are mounted flush on a named surface and REPLACE that much of it: the surface's
// own finish counts only on its net area (gross − panels − openings on it), and each panel/opening
// counts its own area with its own coefficients. The room's total surface S therefore stays the box
// surface, which is what Eyring's ᾱ = A/S needs. Panels spaced off the wall (more exposed edge, better
// bass absorption) are outside this model. Air absorption is left out: in rooms of drum-room size it
// matters little below 4 kHz.

import {
  axialModeHz,
  EYRING_COEFFICIENT_CAP,
  eyringRt60,
  sabineRt60,
  schroederFrequency,
  speedOfSound,
} from './formulas';
import {
  type BandCoefficients,
  isMaterialId,
  isValidCoefficients,
  MATERIALS,
  type MaterialId,
  OCTAVE_BANDS_HZ,
  type OctaveBandHz,
} from './materials';

export * from './formulas';

export const SURFACE_IDS = ['floor', 'ceiling', 'frontWall', 'backWall', 'leftWall', 'rightWall'] as const;
export type SurfaceId = (typeof SURFACE_IDS)[number];

export const SURFACE_LABELS: Readonly<Record<SurfaceId, string>> = {
  floor: 'floor',
  ceiling: 'ceiling',
  frontWall: 'front wall',
  backWall: 'back wall',
  leftWall: 'left wall',
  rightWall: 'right wall',
};

export type SurfaceFinish =
  | { kind: 'material'; materialId: MaterialId }
  | { kind: 'custom'; coefficients: BandCoefficients; label?: string };

/** An opening is a door or window; "open" means nothing fills it, so all sound leaving through it is lost (α = 1). */
export type OpeningFinish = SurfaceFinish | { kind: 'open' };

export interface RoomDimensions {
  lengthM: number;
  widthM: number;
  heightM: number;
}

export interface TreatmentPanel {
  surface: SurfaceId;
  areaM2: number;
  finish: SurfaceFinish;
}

export interface RoomOpening {
  type: 'door' | 'window';
  surface: SurfaceId;
  areaM2: number;
  finish: OpeningFinish;
}

export interface RoomGeometry {
  dimensions: RoomDimensions;
  surfaces: Record<SurfaceId, SurfaceFinish>;
  panels?: readonly TreatmentPanel[];
  openings?: readonly RoomOpening[];
}

export interface AcousticsOptions {
  /** Air temperature for the speed of sound (modes only; the 0.161 constant is fixed). Default 20 °C. */
  temperatureC?: number;
  /** Highest axial mode listed, Hz. Default 300. */
  maxModeHz?: number;
  /** Highest mode order listed per dimension. Default 4. */
  maxModeOrder?: number;
}

export type ModeAxis = 'length' | 'width' | 'height';
export type RtMethod = 'sabine' | 'eyring';
export type RoomReading = 'tight' | 'controlled' | 'lively' | 'very_live';

export interface BandResult {
  hz: OctaveBandHz;
  sabineSec: number;
  eyringSec: number;
  /** ᾱ = A/S with the coefficients as given. */
  averageAbsorption: number;
  /** A = Σ Sᵢ·αᵢ in m² (metric sabins). */
  absorptionAreaM2: number;
}

export interface ModeRef {
  hz: number;
  axis: ModeAxis;
  order: number;
}

export interface ModeResult extends ModeRef {
  /** Modes of other dimensions within COINCIDENCE_TOLERANCE of this one (they reinforce each other). */
  coincidentWith: ModeRef[];
}

export interface SurfaceAreaResult {
  surface: SurfaceId;
  grossM2: number;
  /** What is left of the surface's own finish after panels and openings on it. */
  netM2: number;
}

export interface AcousticsResult {
  bands: BandResult[];
  modes: ModeResult[];
  schroederHz: number;
  reading: RoomReading;
  readingText: string;
  recommended: RtMethod;
  recommendedReason: string;
  /** Mean of the 500 Hz and 1 kHz RT60 by the recommended method: the figure the reading uses. */
  midBandRt60Sec: number;
  midBandAverageAbsorption: number;
  volumeM3: number;
  surfaceM2: number;
  surfaces: SurfaceAreaResult[];
  speedOfSoundMs: number;
  notes: string[];
}

export interface GeometryIssue {
  path: (string | number)[];
  message: string;
}

/** Common practice: Sabine overestimates RT60 in well-damped rooms; above this mean absorption Eyring is preferred. */
export const EYRING_PREFERRED_ABOVE_ALPHA = 0.2;

/** Two modes count as coincident when they differ by at most 5 % of the lower one. */
export const COINCIDENCE_TOLERANCE = 0.05;

/**
 * Readings for drums from the mid-band (500 Hz–1 kHz) RT60. The thresholds are common practice for
 * rooms of tracking-room size, not a standard: below 0.3 s tight, below 0.5 s controlled, below 0.8 s
 * lively, otherwise very live.
 */
export const READING_THRESHOLDS: readonly { reading: Exclude<RoomReading, 'very_live'>; belowSec: number }[] = [
  { reading: 'tight', belowSec: 0.3 },
  { reading: 'controlled', belowSec: 0.5 },
  { reading: 'lively', belowSec: 0.8 },
];

export const READING_LABELS: Readonly<Record<RoomReading, string>> = {
  tight: 'tight',
  controlled: 'controlled',
  lively: 'lively',
  very_live: 'very live',
};

const READING_TEXT: Readonly<Record<RoomReading, string>> = {
  tight:
    'A tight, dry room: the drums sound close and punchy and stop quickly, with little ring. Good when you want a controlled modern sound; any sense of space is added later in the mix.',
  controlled:
    'A controlled room: there is some natural air around the kit, but the ring never gets in the way. A safe choice for most styles.',
  lively:
    'A lively room: the kit rings on and sounds big. Great for rock and open, roomy sounds; less suited to very tight, dry parts.',
  very_live:
    'A very live room: a long ring and a lot of room sound on every hit. Dramatic on big, simple parts; busy parts can blur, and the room mics will colour everything.',
};

/** Our own rule of thumb, not a standard: a 125 Hz RT60 this many times the mid-band one is worth a note. */
export const BASS_RING_RATIO = 1.5;

const DEFAULT_MAX_MODE_HZ = 300;
const DEFAULT_MAX_MODE_ORDER = 4;
const AREA_EPSILON_M2 = 1e-9;

/** International foot, exact by definition: 0.3048 m. */
export function feetToMetres(feet: number): number {
  return feet * 0.3048;
}

export function metresToFeet(metres: number): number {
  return metres / 0.3048;
}

export function roomVolume(d: RoomDimensions): number {
  return d.lengthM * d.widthM * d.heightM;
}

/** Floor and ceiling are length × width; front/back walls span the width, left/right walls the length. */
export function grossSurfaceAreas(d: RoomDimensions): Record<SurfaceId, number> {
  const floor = d.lengthM * d.widthM;
  const endWall = d.widthM * d.heightM;
  const sideWall = d.lengthM * d.heightM;
  return { floor, ceiling: floor, frontWall: endWall, backWall: endWall, leftWall: sideWall, rightWall: sideWall };
}

export function finishCoefficients(finish: OpeningFinish): BandCoefficients {
  if (finish.kind === 'open') return [1, 1, 1, 1, 1, 1];
  if (finish.kind === 'material') return MATERIALS[finish.materialId].bands;
  return finish.coefficients;
}

/** Every problem with a room's geometry, with the path of the offending field (same shape as zod's issues). */
export function validateRoomGeometry(room: RoomGeometry): GeometryIssue[] {
  const fieldIssues = roomGeometryFieldIssues(room);
  return fieldIssues.length > 0 ? fieldIssues : roomGeometryCrossIssues(room);
}

/** Problems with single fields: dimensions, material ids, coefficients, panel and opening areas. */
export function roomGeometryFieldIssues(room: RoomGeometry): GeometryIssue[] {
  const issues: GeometryIssue[] = [];
  issues.push(...validateDimensions(room.dimensions));
  for (const surface of SURFACE_IDS) {
    const finish = room.surfaces?.[surface];
    if (!finish) issues.push({ path: ['surfaces', surface], message: `Choose a finish for the ${SURFACE_LABELS[surface]}` });
    else issues.push(...validateFinish(finish, ['surfaces', surface]));
  }
  (room.panels ?? []).forEach((panel, i) => issues.push(...validatePlacedItem(panel, ['panels', i])));
  (room.openings ?? []).forEach((opening, i) => issues.push(...validatePlacedItem(opening, ['openings', i])));
  return issues;
}

/**
 * Problems between fields: panels and openings larger than their surface, a band in which nothing absorbs.
 * Only meaningful once roomGeometryFieldIssues finds nothing (the zod schemas check single fields themselves).
 */
export function roomGeometryCrossIssues(room: RoomGeometry): GeometryIssue[] {
  return [...validateCoverage(room), ...validateSomeAbsorption(room)];
}

export class RoomGeometryError extends RangeError {
  constructor(readonly issues: GeometryIssue[]) {
    super(`invalid room geometry: ${issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
    this.name = 'RoomGeometryError';
  }
}

export function assertValidRoomGeometry(room: RoomGeometry): void {
  const issues = validateRoomGeometry(room);
  if (issues.length > 0) throw new RoomGeometryError(issues);
}

export function computeAcoustics(room: RoomGeometry, options: AcousticsOptions = {}): AcousticsResult {
  assertValidRoomGeometry(room);
  const c = speedOfSound(options.temperatureC ?? 20);
  const volumeM3 = roomVolume(room.dimensions);
  const surfaces = netSurfaceAreas(room);
  const surfaceM2 = surfaces.reduce((sum, s) => sum + s.grossM2, 0);
  const patches = absorbingPatches(room, surfaces);

  const bands = OCTAVE_BANDS_HZ.map((hz, b) => bandResult(hz, b, patches, volumeM3, surfaceM2));
  const midBandAverageAbsorption = midBand(bands.map((band) => band.averageAbsorption));
  const recommended: RtMethod = midBandAverageAbsorption > EYRING_PREFERRED_ABOVE_ALPHA ? 'eyring' : 'sabine';
  const midBandRt60Sec = midBand(bands.map((band) => (recommended === 'eyring' ? band.eyringSec : band.sabineSec)));
  const modes = flagCoincidences(
    axialModes(room.dimensions, c, options.maxModeHz ?? DEFAULT_MAX_MODE_HZ, options.maxModeOrder ?? DEFAULT_MAX_MODE_ORDER),
  );
  const schroederHz = schroederFrequency(midBandRt60Sec, volumeM3);
  const reading = readingFor(midBandRt60Sec);
  const lowBandRt60 = recommended === 'eyring' ? bands[0].eyringSec : bands[0].sabineSec;

  return {
    bands,
    modes,
    schroederHz,
    reading,
    readingText: READING_TEXT[reading],
    recommended,
    recommendedReason: recommendedReason(recommended, midBandAverageAbsorption),
    midBandRt60Sec,
    midBandAverageAbsorption,
    volumeM3,
    surfaceM2,
    surfaces,
    speedOfSoundMs: c,
    notes: roomNotes(modes, schroederHz, lowBandRt60, midBandRt60Sec),
  };
}

/** The drum reading for a mid-band RT60 (thresholds in READING_THRESHOLDS, common practice). */
export function readingFor(midBandRt60Sec: number): RoomReading {
  for (const t of READING_THRESHOLDS) if (midBandRt60Sec < t.belowSec) return t.reading;
  return 'very_live';
}

export function readingText(reading: RoomReading): string {
  return READING_TEXT[reading];
}

/** First axial modes of each dimension: orders 1…maxOrder up to maxHz; the first mode is always listed. */
export function axialModes(d: RoomDimensions, speedMs: number, maxHz = DEFAULT_MAX_MODE_HZ, maxOrder = DEFAULT_MAX_MODE_ORDER): ModeRef[] {
  const dims: [ModeAxis, number][] = [
    ['length', d.lengthM],
    ['width', d.widthM],
    ['height', d.heightM],
  ];
  const modes: ModeRef[] = [];
  for (const [axis, lengthM] of dims) {
    for (let order = 1; order <= maxOrder; order++) {
      const hz = axialModeHz(order, lengthM, speedMs);
      if (order > 1 && hz > maxHz) break;
      modes.push({ hz, axis, order });
    }
  }
  return modes.sort((a, b) => a.hz - b.hz);
}

/** Marks each mode with the modes of other dimensions within 5 % of it (relative to the lower frequency). */
export function flagCoincidences(modes: readonly ModeRef[], tolerance = COINCIDENCE_TOLERANCE): ModeResult[] {
  return modes.map((mode) => ({
    ...mode,
    coincidentWith: modes
      .filter((other) => other.axis !== mode.axis && Math.abs(other.hz - mode.hz) <= tolerance * Math.min(other.hz, mode.hz))
      .map(({ hz, axis, order }) => ({ hz, axis, order })),
  }));
}

interface Patch {
  areaM2: number;
  coefficients: BandCoefficients;
}

function netSurfaceAreas(room: RoomGeometry): SurfaceAreaResult[] {
  const gross = grossSurfaceAreas(room.dimensions);
  const covered = coveredAreas(room);
  return SURFACE_IDS.map((surface) => ({
    surface,
    grossM2: gross[surface],
    netM2: Math.max(0, gross[surface] - covered[surface]),
  }));
}

function coveredAreas(room: RoomGeometry): Record<SurfaceId, number> {
  const covered = Object.fromEntries(SURFACE_IDS.map((s) => [s, 0])) as Record<SurfaceId, number>;
  for (const item of [...(room.panels ?? []), ...(room.openings ?? [])]) covered[item.surface] += item.areaM2;
  return covered;
}

function absorbingPatches(room: RoomGeometry, surfaces: readonly SurfaceAreaResult[]): Patch[] {
  return [
    ...surfaces.map((s) => ({ areaM2: s.netM2, coefficients: finishCoefficients(room.surfaces[s.surface]) })),
    ...(room.panels ?? []).map((p) => ({ areaM2: p.areaM2, coefficients: finishCoefficients(p.finish) })),
    ...(room.openings ?? []).map((o) => ({ areaM2: o.areaM2, coefficients: finishCoefficients(o.finish) })),
  ];
}

function bandResult(hz: OctaveBandHz, band: number, patches: readonly Patch[], volumeM3: number, surfaceM2: number): BandResult {
  const absorptionAreaM2 = patches.reduce((sum, p) => sum + p.areaM2 * p.coefficients[band], 0);
  const cappedAreaM2 = patches.reduce((sum, p) => sum + p.areaM2 * Math.min(p.coefficients[band], EYRING_COEFFICIENT_CAP), 0);
  return {
    hz,
    sabineSec: sabineRt60(volumeM3, absorptionAreaM2),
    eyringSec: eyringRt60(volumeM3, surfaceM2, cappedAreaM2 / surfaceM2),
    averageAbsorption: absorptionAreaM2 / surfaceM2,
    absorptionAreaM2,
  };
}

/** Mean of the 500 Hz and 1 kHz values (indexes 2 and 3 of OCTAVE_BANDS_HZ). */
function midBand(values: readonly number[]): number {
  return (values[2] + values[3]) / 2;
}

function recommendedReason(method: RtMethod, alpha: number): string {
  const shown = alpha.toFixed(2);
  return method === 'eyring'
    ? `The mid-band average absorption is ${shown}, above ${EYRING_PREFERRED_ABOVE_ALPHA}: in a well-damped room Sabine's formula overstates the ring, so Eyring's is the better estimate (common practice).`
    : `The mid-band average absorption is ${shown}, at most ${EYRING_PREFERRED_ABOVE_ALPHA}: in a fairly reflective room the two formulas agree closely and Sabine's is the usual estimate (common practice).`;
}

function roomNotes(modes: readonly ModeResult[], schroederHz: number, lowBandRt60: number, midBandRt60: number): string[] {
  const notes = [
    `Below about ${Math.round(schroederHz)} Hz the room's resonances (modes) shape the low end more than its reverberation does.`,
  ];
  // One note per group: a mode speaks for its partners unless one of them comes earlier in the (sorted) list.
  const indexOf = (ref: ModeRef) => modes.findIndex((m) => m.axis === ref.axis && m.order === ref.order);
  const coincident = modes.filter((m, i) => m.coincidentWith.length > 0 && m.coincidentWith.every((o) => indexOf(o) > i));
  for (const m of coincident) {
    notes.push(`Modes of the ${[m.axis, ...m.coincidentWith.map((o) => o.axis)].join(' and ')} fall together near ${Math.round(m.hz)} Hz: notes around there may boom.`);
  }
  if (lowBandRt60 >= BASS_RING_RATIO * midBandRt60) {
    notes.push(`The 125 Hz band rings ${(lowBandRt60 / midBandRt60).toFixed(1)} times as long as the middle: expect some boom on kick and floor tom.`);
  }
  return notes;
}

function validateDimensions(d: RoomDimensions | undefined): GeometryIssue[] {
  const fields = ['lengthM', 'widthM', 'heightM'] as const;
  return fields
    .filter((f) => !(d && Number.isFinite(d[f]) && d[f] > 0))
    .map((f) => ({ path: ['dimensions', f], message: 'Must be a positive number of metres' }));
}

function validateFinish(finish: OpeningFinish, path: (string | number)[]): GeometryIssue[] {
  if (finish.kind === 'open') return [];
  if (finish.kind === 'material') {
    return isMaterialId(finish.materialId) ? [] : [{ path: [...path, 'materialId'], message: 'Unknown material' }];
  }
  const values: readonly number[] = finish.coefficients ?? [];
  if (values.length !== OCTAVE_BANDS_HZ.length) {
    return [{ path: [...path, 'coefficients'], message: `Give ${OCTAVE_BANDS_HZ.length} coefficients, one per octave band 125 Hz–4 kHz` }];
  }
  if (isValidCoefficients(values)) return [];
  return (values as readonly number[])
    .map((v, i) => ({ v, i }))
    .filter(({ v }) => !(Number.isFinite(v) && v >= 0 && v <= 1))
    .map(({ i }) => ({ path: [...path, 'coefficients', i], message: 'Absorption coefficients are between 0 and 1' }));
}

function validatePlacedItem(item: TreatmentPanel | RoomOpening, path: (string | number)[]): GeometryIssue[] {
  const issues: GeometryIssue[] = [];
  if (!(SURFACE_IDS as readonly string[]).includes(item.surface)) issues.push({ path: [...path, 'surface'], message: 'Unknown surface' });
  if (!(Number.isFinite(item.areaM2) && item.areaM2 > 0)) issues.push({ path: [...path, 'areaM2'], message: 'Area must be a positive number of square metres' });
  if (!item.finish) issues.push({ path: [...path, 'finish'], message: 'Choose a material' });
  else issues.push(...validateFinish(item.finish, [...path, 'finish']));
  return issues;
}

/** Panels and openings replace part of their surface, so together they cannot exceed it. */
function validateCoverage(room: RoomGeometry): GeometryIssue[] {
  const gross = grossSurfaceAreas(room.dimensions);
  const running = Object.fromEntries(SURFACE_IDS.map((s) => [s, 0])) as Record<SurfaceId, number>;
  const issues: GeometryIssue[] = [];
  const items: [string, number, TreatmentPanel | RoomOpening][] = [
    ...(room.panels ?? []).map((p, i): [string, number, TreatmentPanel] => ['panels', i, p]),
    ...(room.openings ?? []).map((o, i): [string, number, RoomOpening] => ['openings', i, o]),
  ];
  for (const [list, i, item] of items) {
    const before = running[item.surface];
    running[item.surface] = before + item.areaM2;
    if (before <= gross[item.surface] + AREA_EPSILON_M2 && running[item.surface] > gross[item.surface] + AREA_EPSILON_M2) {
      issues.push({
        path: [list, i, 'areaM2'],
        message: `Panels and openings on the ${SURFACE_LABELS[item.surface]} add up to more than its ${gross[item.surface].toFixed(1)} m²`,
      });
    }
  }
  return issues;
}

/** A band in which nothing absorbs would ring forever; no real room does, so such input is a mistake. */
function validateSomeAbsorption(room: RoomGeometry): GeometryIssue[] {
  const patches = absorbingPatches(room, netSurfaceAreas(room));
  return OCTAVE_BANDS_HZ.filter((_, b) => patches.every((p) => p.areaM2 * p.coefficients[b] === 0)).map((hz) => ({
    path: ['surfaces'],
    message: `Nothing in the room absorbs at ${hz} Hz; at least one surface needs a coefficient above 0`,
  }));
}
