// The vocabulary of an input list: what a channel picks up (its source), the kind of microphone and
// its polar pattern. Source ids are snake_case and double as the part ids the delivery check uses for
// stems (kick_in, snare_top, overhead_l …), so a booking's input list can pre-fill the stem names.

export const SOURCE_IDS = [
  'kick_in',
  'kick_out',
  'snare_top',
  'snare_bottom',
  'hi_hat',
  'rack_tom_1',
  'rack_tom_2',
  'rack_tom_3',
  'floor_tom_1',
  'floor_tom_2',
  'overhead_l',
  'overhead_r',
  'room_l',
  'room_r',
  'room_mono',
  'other',
] as const;
export type SourceId = (typeof SOURCE_IDS)[number];

/** close: a mic on one drum or cymbal; overhead and room mics hear the whole kit. */
export type SourceRole = 'close' | 'overhead' | 'room' | 'other';

/** The kit piece a source belongs to; two sources on the same piece (snare top/bottom) share it. */
export type KitPiece =
  | 'kick'
  | 'snare'
  | 'hi_hat'
  | 'rack_tom_1'
  | 'rack_tom_2'
  | 'rack_tom_3'
  | 'floor_tom_1'
  | 'floor_tom_2'
  | 'kit';

/**
 * Which way the mic faces the vibrating surface it hears, for polarity: mics above the kit look down at
 * the heads; the snare bottom mic looks up at the other head, so its signal starts with the opposite sign;
 * kick mics look along the drum's axis, which does not compare with the mics above.
 */
export type Facing = 'down' | 'up' | 'kick_axis' | 'unknown';

export interface SourceInfo {
  id: SourceId;
  label: string;
  role: SourceRole;
  piece: KitPiece;
  facing: Facing;
}

const SOURCE_LIST: readonly SourceInfo[] = [
  { id: 'kick_in', label: 'Kick in', role: 'close', piece: 'kick', facing: 'kick_axis' },
  { id: 'kick_out', label: 'Kick out', role: 'close', piece: 'kick', facing: 'kick_axis' },
  { id: 'snare_top', label: 'Snare top', role: 'close', piece: 'snare', facing: 'down' },
  { id: 'snare_bottom', label: 'Snare bottom', role: 'close', piece: 'snare', facing: 'up' },
  { id: 'hi_hat', label: 'Hi-hat', role: 'close', piece: 'hi_hat', facing: 'down' },
  { id: 'rack_tom_1', label: 'Rack tom 1', role: 'close', piece: 'rack_tom_1', facing: 'down' },
  { id: 'rack_tom_2', label: 'Rack tom 2', role: 'close', piece: 'rack_tom_2', facing: 'down' },
  { id: 'rack_tom_3', label: 'Rack tom 3', role: 'close', piece: 'rack_tom_3', facing: 'down' },
  { id: 'floor_tom_1', label: 'Floor tom 1', role: 'close', piece: 'floor_tom_1', facing: 'down' },
  { id: 'floor_tom_2', label: 'Floor tom 2', role: 'close', piece: 'floor_tom_2', facing: 'down' },
  { id: 'overhead_l', label: 'Overhead left', role: 'overhead', piece: 'kit', facing: 'down' },
  { id: 'overhead_r', label: 'Overhead right', role: 'overhead', piece: 'kit', facing: 'down' },
  { id: 'room_l', label: 'Room left', role: 'room', piece: 'kit', facing: 'unknown' },
  { id: 'room_r', label: 'Room right', role: 'room', piece: 'kit', facing: 'unknown' },
  { id: 'room_mono', label: 'Mono room', role: 'room', piece: 'kit', facing: 'unknown' },
  { id: 'other', label: 'Other', role: 'other', piece: 'kit', facing: 'unknown' },
];

export const SOURCES: Readonly<Record<SourceId, SourceInfo>> = Object.freeze(
  Object.fromEntries(SOURCE_LIST.map((s) => [s.id, s])) as Record<SourceId, SourceInfo>,
);

export function listSources(): readonly SourceInfo[] {
  return SOURCE_LIST;
}

export const MIC_TYPES = ['dynamic', 'small_diaphragm_condenser', 'large_diaphragm_condenser', 'ribbon', 'boundary'] as const;
export type MicType = (typeof MIC_TYPES)[number];

export const MIC_TYPE_LABELS: Readonly<Record<MicType, string>> = {
  dynamic: 'Dynamic',
  small_diaphragm_condenser: 'Small-diaphragm condenser',
  large_diaphragm_condenser: 'Large-diaphragm condenser',
  ribbon: 'Ribbon',
  boundary: 'Boundary',
};

export const POLAR_PATTERNS = ['cardioid', 'supercardioid', 'hypercardioid', 'figure_eight', 'omni'] as const;
export type PolarPattern = (typeof POLAR_PATTERNS)[number];

export const POLAR_PATTERN_LABELS: Readonly<Record<PolarPattern, string>> = {
  cardioid: 'Cardioid',
  supercardioid: 'Supercardioid',
  hypercardioid: 'Hypercardioid',
  figure_eight: 'Figure-eight',
  omni: 'Omni',
};

/** Cardioid, supercardioid and hypercardioid: one front lobe and a rejecting rear. */
export function isCardioidFamily(pattern: PolarPattern): boolean {
  return pattern === 'cardioid' || pattern === 'supercardioid' || pattern === 'hypercardioid';
}

/** One row of an input list, as the pure mic-package helpers need it. */
export interface MicChannel {
  number: number;
  source: SourceId;
  micType: MicType;
  pattern: PolarPattern;
  /** Distance from the capsule to the source in cm; null/undefined when the engineer did not say. */
  distanceCm?: number | null;
  aim?: string | null;
  lowCut: boolean;
  polarityInvert: boolean;
  model?: string | null;
  note?: string | null;
}
