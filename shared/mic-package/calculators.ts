// Calculators beside the input list: how far apart two mics are in time, where that puts the first
// comb-filter notch when their signals are summed, the offset to expect between each close mic and the
// overheads, and the 3:1 check for neighbouring close mics.
//
// Physics from REFERENCES.md (from memory): c ≈ 331.3 + 0.606·T m/s (343 m/s at 20 °C); two equal
// signals summed with delay τ cancel at f = (2k+1)/(2τ), so 1 ms puts the first notch at 500 Hz.

import { speedOfSound } from '../acoustics/formulas';
import { SOURCES, type MicChannel, type SourceId } from './sources';

export const DEFAULT_SESSION_RATE_HZ = 48_000;

export interface CalculatorOptions {
  /** Session sample rate in Hz. Default 48 kHz. */
  sampleRate?: number;
  /** Air temperature in °C. Default 20 °C. */
  temperatureC?: number;
}

export interface DelayResult {
  distanceCm: number;
  ms: number;
  /** Fractional samples at the session rate; the UI rounds for display. */
  samples: number;
  /** First cancellation when the two signals are summed; null when there is no delay. */
  firstNotchHz: number | null;
}

/** Delay, in ms and samples, of sound covering a distance difference; the sign follows the distance. */
export function delayForDistance(distanceCm: number, options: CalculatorOptions = {}): DelayResult {
  if (!Number.isFinite(distanceCm)) throw new RangeError(`distance must be a finite number, got ${distanceCm}`);
  const sampleRate = checkedRate(options.sampleRate ?? DEFAULT_SESSION_RATE_HZ);
  const c = speedOfSound(options.temperatureC ?? 20);
  const seconds = distanceCm / 100 / c;
  return {
    distanceCm,
    ms: seconds * 1000,
    samples: seconds * sampleRate,
    firstNotchHz: seconds === 0 ? null : firstCombNotchHz(Math.abs(seconds * 1000)),
  };
}

/** The distance sound covers in a given delay, cm (the inverse of delayForDistance). */
export function distanceForDelay(ms: number, options: Pick<CalculatorOptions, 'temperatureC'> = {}): number {
  if (!Number.isFinite(ms)) throw new RangeError(`delay must be a finite number, got ${ms}`);
  return (ms / 1000) * speedOfSound(options.temperatureC ?? 20) * 100;
}

/** First notch of the comb filter from summing a signal with a copy delayed by `delayMs`: f = 1/(2τ). */
export function firstCombNotchHz(delayMs: number): number {
  if (!(Number.isFinite(delayMs) && delayMs > 0)) throw new RangeError(`delay must be a positive number of ms, got ${delayMs}`);
  return 1000 / (2 * delayMs);
}

/** All notches f = (2k+1)/(2τ) up to maxHz, lowest first. */
export function combNotchesHz(delayMs: number, maxHz = 20_000): number[] {
  const first = firstCombNotchHz(delayMs);
  const notches: number[] = [];
  for (let k = 0; first * (2 * k + 1) <= maxHz; k++) notches.push(first * (2 * k + 1));
  return notches;
}

export interface OverheadOffset extends DelayResult {
  closeChannel: number;
  closeSource: SourceId;
  overheadChannel: number;
  overheadSource: SourceId;
}

/**
 * Expected arrival difference between each close mic and each overhead, from their distances to the
 * source: the overhead hears the drum later by (d_overhead − d_close)/c. The overhead's distance is the one
 * the engineer gave (usually measured to the snare), so for other drums this is an estimate.
 */
export function closeMicOverheadOffsets(channels: readonly MicChannel[], options: CalculatorOptions = {}): OverheadOffset[] {
  const close = channels.filter((ch) => SOURCES[ch.source].role === 'close' && hasDistance(ch));
  const overheads = channels.filter((ch) => SOURCES[ch.source].role === 'overhead' && hasDistance(ch));
  return close.flatMap((c) =>
    overheads.map((o) => ({
      closeChannel: c.number,
      closeSource: c.source,
      overheadChannel: o.number,
      overheadSource: o.source,
      ...delayForDistance((o.distanceCm as number) - (c.distanceCm as number), options),
    })),
  );
}

export interface KitNeighbours {
  a: SourceId;
  b: SourceId;
  /** Assumed distance between the two mics' sources on a common kit layout, cm; the engineer can enter the real one. */
  typicalSpacingCm: number;
}

/**
 * Close mics that sit next to each other on a common kit layout (common practice for where bleed
 * matters). The spacings are rough centre-to-centre figures for a typical five-piece set-up, written
 * from memory: they only stand in until the engineer enters the real spacing.
 */
export const KIT_NEIGHBOURS: readonly KitNeighbours[] = [
  { a: 'snare_top', b: 'hi_hat', typicalSpacingCm: 35 },
  { a: 'snare_top', b: 'rack_tom_1', typicalSpacingCm: 35 },
  // The kick-in mic sits inside the shell, below and in front of the snare.
  { a: 'kick_in', b: 'snare_bottom', typicalSpacingCm: 50 },
  { a: 'rack_tom_1', b: 'rack_tom_2', typicalSpacingCm: 30 },
  { a: 'rack_tom_2', b: 'rack_tom_3', typicalSpacingCm: 30 },
  { a: 'rack_tom_1', b: 'floor_tom_1', typicalSpacingCm: 50 },
  { a: 'rack_tom_2', b: 'floor_tom_1', typicalSpacingCm: 40 },
  { a: 'rack_tom_3', b: 'floor_tom_1', typicalSpacingCm: 40 },
  { a: 'floor_tom_1', b: 'floor_tom_2', typicalSpacingCm: 45 },
];

/** Common practice: mics at least three times as far from each other as each is from its own source. */
export const THREE_TO_ONE_RATIO = 3;

/** Key for a neighbour pair, order-free, used for the engineer's own spacings: "hi_hat|snare_top". */
export function neighbourKey(a: SourceId, b: SourceId): string {
  return [a, b].sort().join('|');
}

export interface ThreeToOneCheck {
  channelA: number;
  sourceA: SourceId;
  channelB: number;
  sourceB: SourceId;
  spacingCm: number;
  /** True when spacingCm is the assumed typical figure, not one the engineer entered. */
  spacingAssumed: boolean;
  /** The spacing the rule asks for: 3 × the larger of the two mic distances. */
  requiredSpacingCm: number;
  ratio: number;
  ok: boolean;
  message: string;
  basis: 'common practice';
}

/**
 * The 3:1 rule for neighbouring close mics where both distances are given. The distance between the two
 * mics is taken as the spacing of their sources (both mics sit close to their drums, so the error is small).
 */
export function threeToOneChecks(
  channels: readonly MicChannel[],
  spacingsCm: Readonly<Record<string, number>> = {},
): ThreeToOneCheck[] {
  const checks: ThreeToOneCheck[] = [];
  for (const pair of KIT_NEIGHBOURS) {
    const given = spacingsCm[neighbourKey(pair.a, pair.b)];
    const spacingAssumed = !(typeof given === 'number' && Number.isFinite(given) && given > 0);
    const spacingCm = spacingAssumed ? pair.typicalSpacingCm : given;
    for (const a of channels.filter((ch) => ch.source === pair.a && hasDistance(ch))) {
      for (const b of channels.filter((ch) => ch.source === pair.b && hasDistance(ch))) {
        checks.push(threeToOne(a, b, spacingCm, spacingAssumed));
      }
    }
  }
  return checks;
}

function threeToOne(a: MicChannel, b: MicChannel, spacingCm: number, spacingAssumed: boolean): ThreeToOneCheck {
  const farther = Math.max(a.distanceCm as number, b.distanceCm as number);
  const ratio = spacingCm / farther;
  const ok = ratio >= THREE_TO_ONE_RATIO;
  const names = `${SOURCES[a.source].label} (ch ${a.number}) and ${SOURCES[b.source].label} (ch ${b.number})`;
  const spacingText = `${round1(spacingCm)} cm${spacingAssumed ? ' (a typical spacing; enter yours)' : ''}`;
  const message = ok
    ? `${names}: ${spacingText} apart against mics up to ${round1(farther)} cm from their sources, ${round1(ratio)}:1. Keeps 3:1.`
    : `${names}: ${spacingText} apart but a mic ${round1(farther)} cm from its source wants at least ${round1(THREE_TO_ONE_RATIO * farther)} cm, only ${round1(ratio)}:1. Move the mics closer to their drums or further apart to keep bleed down (3:1, common practice).`;
  return {
    channelA: a.number,
    sourceA: a.source,
    channelB: b.number,
    sourceB: b.source,
    spacingCm,
    spacingAssumed,
    requiredSpacingCm: THREE_TO_ONE_RATIO * farther,
    ratio,
    ok,
    message,
    basis: 'common practice',
  };
}

function hasDistance(ch: MicChannel): boolean {
  return typeof ch.distanceCm === 'number' && Number.isFinite(ch.distanceCm) && ch.distanceCm > 0;
}

function checkedRate(rate: number): number {
  if (!(Number.isFinite(rate) && rate > 0)) throw new RangeError(`sample rate must be a positive number, got ${rate}`);
  return rate;
}

function round1(value: number): string {
  return String(Math.round(value * 10) / 10);
}
