// Related channels in a package, and the relative polarity the delivery check should expect between
// their recorded stems. The booking stores this list so the check knows which stems to compare.
//
// Reasoning (documented because it is easy to get backwards): the check compares the stems AS RECORDED.
// Two mics facing each other across a drum (snare top looking down, snare bottom looking up) see the head
// move in opposite directions, so their raw signals are inverted against each other. If exactly one of the
// two channels has its polarity-invert switch on, that is undone before recording and the stems match;
// if neither (or both) has it on, the stems stay inverted. So:
//   expectInverted = facesOpposite XOR (invertA XOR invertB).
// Mics looking the same way (overhead L/R, a tom mic and the overheads, kick in and kick out along the drum's
// axis) start from "same" and only a single switch makes them inverted. A kick mic against the overheads
// looks along a different axis; there is no dependable expectation, so that pair carries null and the
// check reports what it measures. Facings are in sources.ts.

import { delayForDistance, type CalculatorOptions } from './calculators';
import { SOURCES, type Facing, type MicChannel, type SourceId } from './sources';

export type PairKind = 'top_bottom' | 'in_out' | 'overhead_pair' | 'close_overhead';

export interface PackagePair {
  kind: PairKind;
  aChannel: number;
  aSource: SourceId;
  bChannel: number;
  bSource: SourceId;
  /** Whether b's stem should measure as polarity-inverted against a's; null when no dependable expectation. */
  expectInverted: boolean | null;
  /** Expected arrival of b after a in ms, from the mic distances; null where distances do not predict it. */
  expectedLagMs: number | null;
  reason: string;
}

/** Related pairs in an input list: snare top/bottom, kick in/out, overhead L/R, each close mic vs each overhead. */
export function packagePairs(channels: readonly MicChannel[], options: CalculatorOptions = {}): PackagePair[] {
  const of = (source: SourceId) => channels.filter((ch) => ch.source === source);
  const byRole = (role: 'close' | 'overhead') => channels.filter((ch) => SOURCES[ch.source].role === role);
  return [
    ...crossPairs('top_bottom', of('snare_top'), of('snare_bottom'), options),
    ...crossPairs('in_out', of('kick_in'), of('kick_out'), options),
    ...crossPairs('overhead_pair', of('overhead_l'), of('overhead_r'), options),
    ...crossPairs('close_overhead', byRole('close'), byRole('overhead'), options),
  ];
}

/** Whether two mics' raw signals start with opposite signs, from which way each faces; null when they do not compare. */
export function facesOpposite(a: Facing, b: Facing): boolean | null {
  if (a === 'unknown' || b === 'unknown') return null;
  if (a === 'kick_axis' || b === 'kick_axis') return a === b ? false : null;
  return a !== b;
}

/** The stems' expected relative polarity, given the raw relation and the two invert switches. */
export function expectInverted(a: MicChannel, b: MicChannel): boolean | null {
  const opposite = facesOpposite(SOURCES[a.source].facing, SOURCES[b.source].facing);
  if (opposite === null) return null;
  const oneSwitched = a.polarityInvert !== b.polarityInvert;
  return opposite !== oneSwitched;
}

function crossPairs(kind: PairKind, as: readonly MicChannel[], bs: readonly MicChannel[], options: CalculatorOptions): PackagePair[] {
  return as.flatMap((a) => bs.map((b) => pair(kind, a, b, options)));
}

function pair(kind: PairKind, a: MicChannel, b: MicChannel, options: CalculatorOptions): PackagePair {
  const expected = expectInverted(a, b);
  return {
    kind,
    aChannel: a.number,
    aSource: a.source,
    bChannel: b.number,
    bSource: b.source,
    expectInverted: expected,
    expectedLagMs: expectedLagMs(kind, a, b, options),
    reason: pairReason(a, b, expected),
  };
}

/** Only mics measured to the same point predict a lag: the overheads against each other and against close mics. */
function expectedLagMs(kind: PairKind, a: MicChannel, b: MicChannel, options: CalculatorOptions): number | null {
  if (kind !== 'close_overhead' && kind !== 'overhead_pair') return null;
  if (typeof a.distanceCm !== 'number' || typeof b.distanceCm !== 'number') return null;
  return delayForDistance(b.distanceCm - a.distanceCm, options).ms;
}

function pairReason(a: MicChannel, b: MicChannel, expected: boolean | null): string {
  const nameA = SOURCES[a.source].label.toLowerCase();
  const nameB = SOURCES[b.source].label.toLowerCase();
  if (expected === null) return `The ${nameA} and ${nameB} mics look along different axes: no polarity is expected; the check reports what it measures.`;
  const opposite = facesOpposite(SOURCES[a.source].facing, SOURCES[b.source].facing);
  const switched = a.polarityInvert !== b.polarityInvert;
  const facing = opposite ? 'face opposite ways' : 'face the same way';
  const switches = switched
    ? 'one of them is recorded with the polarity switch on'
    : a.polarityInvert
      ? 'both have the polarity switch on, which cancels out'
      : 'neither has the polarity switch on';
  const outcome = expected ? `so the ${nameB} stem should read as inverted against the ${nameA}` : 'so the two stems should read as the same polarity';
  return `The ${nameA} and ${nameB} mics ${facing} and ${switches}, ${outcome}.`;
}

/** What the delivery check needs from a booking's package: pairs of part ids (stem parts = source ids). */
export interface DeliveryExpectPair {
  a: SourceId;
  b: SourceId;
  /** Left out where the package gives no dependable expectation (a kick against the overheads). */
  expectInverted?: boolean;
}

/**
 * The package's pairs as the delivery check's `pairs` input. Stems are named by part, not channel, so two
 * channels on the same source collapse into one pair (the first one listed wins).
 */
export function deliveryExpectPairs(pairs: readonly PackagePair[]): DeliveryExpectPair[] {
  const seen = new Set<string>();
  const out: DeliveryExpectPair[] = [];
  for (const p of pairs) {
    const key = `${p.aSource}|${p.bSource}`;
    if (seen.has(key) || p.aSource === p.bSource) continue;
    seen.add(key);
    out.push(p.expectInverted === null ? { a: p.aSource, b: p.bSource } : { a: p.aSource, b: p.bSource, expectInverted: p.expectInverted });
  }
  return out;
}
