import { SOURCE_IDS, type SourceId } from '../mic-package/sources';

// The drum parts a delivered stem can be, how a part is guessed from a file name, and which parts
// are related closely enough to compare for time offset and polarity. Part ids are the mic-package source
// ids (one list), so a booking's input list can pre-fill the stem names.

// One list of ids for both vocabularies: a stem's part is the source its mic was on.
export const PART_IDS = SOURCE_IDS;
export type PartId = SourceId;

export type PartRole = 'close' | 'overhead' | 'room' | 'other';

export interface DrumPart {
  id: PartId;
  label: string;
  role: PartRole;
  /** The drum or cymbal a close mic is on; 'kit' for mics that hear everything. */
  piece: string;
  /** Which way the mic faces the head it hears (common practice): decides the expected polarity. */
  facing: 'down' | 'up' | 'kick_axis' | 'unknown';
}

export const DRUM_PARTS: readonly DrumPart[] = [
  { id: 'kick_in', label: 'Kick in', role: 'close', piece: 'kick', facing: 'kick_axis' },
  { id: 'kick_out', label: 'Kick out', role: 'close', piece: 'kick', facing: 'kick_axis' },
  { id: 'snare_top', label: 'Snare top', role: 'close', piece: 'snare', facing: 'down' },
  { id: 'snare_bottom', label: 'Snare bottom', role: 'close', piece: 'snare', facing: 'up' },
  { id: 'hi_hat', label: 'Hi-hat', role: 'close', piece: 'hi_hat', facing: 'down' },
  { id: 'rack_tom_1', label: 'Rack tom 1', role: 'close', piece: 'rack_tom_1', facing: 'down' },
  { id: 'rack_tom_2', label: 'Rack tom 2', role: 'close', piece: 'rack_tom_2', facing: 'down' },
  { id: 'rack_tom_3', label: 'Rack tom 3', role: 'close', piece: 'rack_tom_3', facing: 'down' },
  { id: 'floor_tom_1', label: 'Floor tom', role: 'close', piece: 'floor_tom_1', facing: 'down' },
  { id: 'floor_tom_2', label: 'Floor tom 2', role: 'close', piece: 'floor_tom_2', facing: 'down' },
  { id: 'overhead_l', label: 'Overhead left', role: 'overhead', piece: 'kit', facing: 'down' },
  { id: 'overhead_r', label: 'Overhead right', role: 'overhead', piece: 'kit', facing: 'down' },
  { id: 'room_l', label: 'Room left', role: 'room', piece: 'kit', facing: 'unknown' },
  { id: 'room_r', label: 'Room right', role: 'room', piece: 'kit', facing: 'unknown' },
  { id: 'room_mono', label: 'Mono room', role: 'room', piece: 'kit', facing: 'unknown' },
  { id: 'other', label: 'Other', role: 'other', piece: 'kit', facing: 'unknown' },
];

const PART_BY_ID = new Map<string, DrumPart>(DRUM_PARTS.map((p) => [p.id, p]));

export function getPart(id: string): DrumPart | undefined {
  return PART_BY_ID.get(id);
}

export function isPartId(id: string): id is PartId {
  return PART_BY_ID.has(id);
}

// Words seen in common stem naming (common practice; no single standard exists).
const KICK = ['kick', 'kik', 'kck', 'bd', 'bassdrum', 'kk'];
const SNARE = ['snare', 'snr', 'sn', 'sd', 'sna'];
const HAT = ['hh', 'hat', 'hats', 'hihat', 'hihats', 'hhat'];
const TOM = ['tom', 'toms', 'tm', 't', 'rt', 'rack', 'racktom'];
const FLOOR = ['ft', 'floor', 'floortom', 'ftom'];
const OVERHEAD = ['oh', 'ovh', 'ohd', 'overhead', 'overheads', 'ovhd', 'ohs'];
const ROOM = ['room', 'rooms', 'rm', 'amb', 'ambience', 'ambient'];
const INSIDE = ['in', 'inside', 'int', 'i'];
const OUTSIDE = ['out', 'outside', 'front', 'reso', 'ext', 'o', 'sub'];
const TOP = ['top', 'up', 'upper', 'tp'];
const BOTTOM = ['bottom', 'bot', 'btm', 'under', 'bt', 'lower', 'b', 'dn', 'down'];
const LEFT = ['l', 'left', 'lt'];
const RIGHT = ['r', 'right', 'rt'];
const HIGH = ['hi', 'high'];
const MID = ['mid', 'middle'];
const LOW = ['lo', 'low'];
const SIDE_WORDS = [...INSIDE, ...OUTSIDE, ...TOP, ...BOTTOM, ...LEFT, ...RIGHT];
const PIECE_WORDS = [...KICK, ...SNARE, ...OVERHEAD, ...ROOM, 'ft', 'tom'].sort((a, b) => b.length - a.length);

/** Splits a compact token like "kikout", "snbot" or "ohl" into its piece and side words. */
function splitCompact(token: string): string[] {
  for (const piece of PIECE_WORDS) {
    if (token.length > piece.length && token.startsWith(piece)) {
      const rest = token.slice(piece.length);
      if (SIDE_WORDS.includes(rest) || /^\d+$/.test(rest)) return [piece, rest];
    }
  }
  return [token];
}

/** "01_Kick In.wav" → ["01", "kick", "in"]: extension dropped, camelCase, digits and separators split. */
export function nameTokens(fileName: string): string[] {
  const base = fileName.replace(/^.*[\\/]/, '').replace(/\.(wav|wave|bwf|rf64|w64)$/i, '');
  const spaced = base
    .replace(/hi[\s_-]?hats?/gi, 'hihat')
    .replace(/([a-z])([A-Z])/g, '$1 $2')
    .replace(/([a-zA-Z])(\d)/g, '$1 $2')
    .replace(/(\d)([a-zA-Z])/g, '$1 $2')
    .toLowerCase();
  return spaced
    .split(/[^a-z0-9]+/)
    .filter(Boolean)
    .flatMap(splitCompact);
}

function hasAny(tokens: string[], words: readonly string[]): boolean {
  return tokens.some((t) => words.includes(t));
}

function firstNumber(tokens: string[], after: readonly string[]): number | null {
  for (let i = 0; i < tokens.length - 1; i++) {
    if (after.includes(tokens[i]) && /^\d$/.test(tokens[i + 1])) return Number(tokens[i + 1]);
  }
  return null;
}

function tomPart(tokens: string[]): PartId | null {
  const floor = hasAny(tokens, FLOOR) || (hasAny(tokens, ['tom', 'toms']) && hasAny(tokens, LOW));
  if (floor) return firstNumber(tokens, FLOOR) === 2 || firstNumber(tokens, ['tom']) === 2 && hasAny(tokens, ['floor']) ? 'floor_tom_2' : 'floor_tom_1';
  const isTom = hasAny(tokens, ['tom', 'toms', 'tm', 'racktom', 'rack']) || tokens.some((t, i) => (t === 't' || t === 'rt') && /^\d$/.test(tokens[i + 1] ?? ''));
  if (!isTom) return null;
  const n = firstNumber(tokens, TOM);
  if (n === 2 || hasAny(tokens, MID)) return 'rack_tom_2';
  if (n === 3) return 'rack_tom_3';
  return 'rack_tom_1';
}

function sided(tokens: string[], left: PartId, right: PartId, neither: PartId): PartId {
  if (hasAny(tokens, LEFT)) return left;
  if (hasAny(tokens, RIGHT)) return right;
  return neither;
}

/**
 * Guesses a part from a file name ("Kick In.wav", "KIK_OUT", "SN BOT", "snr_top", "HH", "OH L",
 * "Tom 1", "FT", "Room R" …); null when nothing in the name says which drum it is.
 */
export function suggestPart(fileName: string): PartId | null {
  const tokens = nameTokens(fileName);
  if (hasAny(tokens, KICK) || (tokens.includes('bass') && tokens.includes('drum'))) {
    return hasAny(tokens, OUTSIDE) ? 'kick_out' : 'kick_in';
  }
  if (hasAny(tokens, SNARE)) return hasAny(tokens, BOTTOM) ? 'snare_bottom' : 'snare_top';
  if (hasAny(tokens, HAT)) return 'hi_hat';
  if (hasAny(tokens, OVERHEAD)) return sided(tokens, 'overhead_l', 'overhead_r', 'overhead_l');
  if (hasAny(tokens, ROOM)) return sided(tokens, 'room_l', 'room_r', 'room_mono');
  if (hasAny(tokens, HIGH) && hasAny(tokens, ['tom', 'toms'])) return 'rack_tom_1';
  return tomPart(tokens);
}

export type RelatedKind = 'same_drum' | 'close_overhead';

export interface RelatedPair {
  a: PartId;
  b: PartId;
  kind: RelatedKind;
  /** Raw recordings of this pair normally come out in opposite polarity (mics facing each other). */
  expectInverted: boolean;
  /** The part to flip when the polarity needs fixing (common practice). */
  flip: PartId;
  /** False where the mics face different axes, so no polarity is "right" (kick against overheads). */
  judgePolarity: boolean;
}

const CLOSE_FOR_OVERHEADS: PartId[] = ['kick_in', 'kick_out', 'snare_top', 'snare_bottom', 'hi_hat', 'rack_tom_1', 'rack_tom_2', 'rack_tom_3', 'floor_tom_1', 'floor_tom_2'];

/**
 * The standard related pairs among the given parts: two mics on one drum (kick in/out, snare top/bottom)
 * and each close mic against each overhead. Rooms are left out: they usually sit more than 3.4 m
 * (10 ms) away, beyond the correlation window.
 */
export function relatedPairs(parts: readonly PartId[]): RelatedPair[] {
  const present = new Set(parts);
  const pairs: RelatedPair[] = [];
  if (present.has('kick_in') && present.has('kick_out')) {
    pairs.push({ a: 'kick_in', b: 'kick_out', kind: 'same_drum', expectInverted: false, flip: 'kick_out', judgePolarity: true });
  }
  if (present.has('snare_top') && present.has('snare_bottom')) {
    // The bottom mic faces up at the snares while the top mic faces down: flip the bottom one.
    pairs.push({ a: 'snare_top', b: 'snare_bottom', kind: 'same_drum', expectInverted: true, flip: 'snare_bottom', judgePolarity: true });
  }
  for (const overhead of ['overhead_l', 'overhead_r'] as const) {
    if (!present.has(overhead)) continue;
    for (const close of CLOSE_FOR_OVERHEADS) {
      if (!present.has(close)) continue;
      const facing = getPart(close)?.facing;
      // Kick mics look along the drum, not down like the overheads: their offset counts, their
      // polarity against the overheads has no right answer.
      pairs.push({ a: close, b: overhead, kind: 'close_overhead', expectInverted: facing === 'up', flip: close, judgePolarity: facing !== 'kick_axis' });
    }
  }
  return pairs;
}
