import type { DeliveryExpect } from '../../audio/check-delivery';
import type { BookingTerms } from '../../db/schema';
import type { BookingInputList } from '@shared/schemas/mic-packages';
import { getPart, suggestPart } from '@shared/stems/parts';

// What the delivery check expects, from the booking's frozen terms and (when the quote named a mic
// package) its input list.

/**
 * Beats per bar in quarter notes: DAW tempos count quarter notes (common practice), so a 6/8 bar at
 * "120 BPM" lasts three quarter-note beats and a 7/8 bar three and a half.
 */
export function quarterBeatsPerBar(timeSignature: string): number | undefined {
  const match = /^\s*(\d{1,2})\s*\/\s*(1|2|4|8|16|32)\s*$/.exec(timeSignature);
  if (!match) return undefined;
  const beats = Number(match[1]);
  if (beats <= 0) return undefined;
  return (beats * 4) / Number(match[2]);
}

/** A song length in bars; a brief that gave seconds is turned into the bars those seconds hold. */
function barsOf(terms: Pick<BookingTerms, 'lengthBars' | 'lengthSeconds' | 'tempoBpm'>, beatsPerBar: number): number | undefined {
  if (terms.lengthBars && terms.lengthBars > 0) return terms.lengthBars;
  if (terms.lengthSeconds && terms.lengthSeconds > 0 && terms.tempoBpm > 0) return (terms.lengthSeconds * terms.tempoBpm) / 60 / beatsPerBar;
  return undefined;
}

export function isBookingInputList(value: unknown): value is BookingInputList {
  const v = value as Partial<BookingInputList> | null;
  return !!v && typeof v === 'object' && Array.isArray(v.channels) && Array.isArray(v.checkPairs);
}

/** File name per part: the first file with that part (as the engine pairs by part, first one wins). */
function fileByPart(files: { name: string; part: string | null }[]): Map<string, string> {
  const map = new Map<string, string>();
  for (const f of files) {
    const part = f.part ?? suggestPart(f.name);
    if (part && !map.has(part)) map.set(part, f.name);
  }
  return map;
}

export function expectFor(
  terms: Pick<BookingTerms, 'deliverables' | 'tempoBpm' | 'timeSignature' | 'lengthBars' | 'lengthSeconds'>,
  inputList: unknown,
  files: { name: string; part: string | null }[],
): DeliveryExpect {
  const beatsPerBar = quarterBeatsPerBar(terms.timeSignature) ?? 4;
  const expect: DeliveryExpect = {
    sampleRate: terms.deliverables.sampleRate,
    bitDepth: terms.deliverables.bitDepth === '32f' ? '32f' : Number(terms.deliverables.bitDepth),
  };
  const bars = barsOf(terms, beatsPerBar);
  if (terms.tempoBpm > 0 && bars) Object.assign(expect, { tempo: terms.tempoBpm, bars, beatsPerBar });
  if (isBookingInputList(inputList)) {
    const byPart = fileByPart(files);
    const pairs = inputList.checkPairs
      .map((p) => ({ a: byPart.get(p.a), b: byPart.get(p.b), expectInverted: p.expectInverted }))
      .filter((p): p is { a: string; b: string; expectInverted: boolean | undefined } => !!p.a && !!p.b && p.a !== p.b)
      .map((p) => (p.expectInverted === undefined ? { a: p.a, b: p.b } : p));
    if (pairs.length > 0) expect.pairs = pairs;
  }
  return expect;
}

/** The stem list the booking's package suggests: one entry per channel, in channel order. */
export function inputListStems(inputList: unknown): { number: number; part: string; label: string }[] {
  if (!isBookingInputList(inputList)) return [];
  return [...inputList.channels]
    .sort((a, b) => a.number - b.number)
    .map((c) => ({ number: c.number, part: c.source, label: getPart(c.source)?.label ?? c.source }));
}
