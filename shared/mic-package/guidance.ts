// Placement guidance shown beside each channel of an input list, and soft hints when a channel departs
// from it. Everything here is common practice in the trade (issue 6 lists the points) and is marked so:
// an engineer may have good reasons to do otherwise, so hints never block saving.

import { COMMON_DISTANCE_RANGES_CM } from './templates';
import { isCardioidFamily, MIC_TYPE_LABELS, SOURCES, type MicChannel, type SourceId } from './sources';

export type GuidanceBasis = 'common practice';

export interface GuidanceEntry {
  id: 'hi_hat' | 'snare_bottom' | 'snare_top' | 'general';
  title: string;
  /** The sources this entry is shown beside; the general entry applies to every channel. */
  appliesTo: readonly SourceId[] | 'all';
  points: readonly string[];
  basis: GuidanceBasis;
}

export const PLACEMENT_GUIDANCE: readonly GuidanceEntry[] = [
  {
    id: 'hi_hat',
    title: 'Hi-hat',
    appliesTo: ['hi_hat'],
    basis: 'common practice',
    points: [
      "A small-diaphragm condenser about 15–20 cm from the cymbal's edge.",
      'Aimed toward the edge it sounds softer; toward the middle, harder.',
      'Never in the path of the air pushed out when the hi-hat closes.',
      'Keep it off-axis to the snare and cymbals to limit crosstalk.',
    ],
  },
  {
    id: 'snare_bottom',
    title: 'Snare bottom',
    appliesTo: ['snare_bottom'],
    basis: 'common practice',
    points: [
      'Close to the resonant head.',
      "A figure-eight pattern with its null toward the kick drum rejects the kick; a cardioid turned away from the kick is the alternative.",
      "Engage the mic's low-cut so the kick's sub-bass is not recorded.",
      'Facing the opposite way to the top mic, it needs its polarity flipped when mixed.',
    ],
  },
  {
    id: 'snare_top',
    title: 'Snare top',
    appliesTo: ['snare_top'],
    basis: 'common practice',
    points: [
      'A dynamic cardioid with its rear (180°) null toward the toms and cymbals.',
      'Aimed at the rim it sounds more like the drum; aimed at the middle, softer and roomier.',
    ],
  },
  {
    id: 'general',
    title: 'Stands and cables',
    appliesTo: 'all',
    basis: 'common practice',
    points: [
      'Stands decoupled from the floor (rubber feet), never touching the kit or each other: that puts subsonic noise on the tracks.',
      'Every clamp tight.',
      'Cables routed so a faulty mic or cable can be swapped quickly and nobody trips.',
      'Tall room-mic stands are top-heavy and fall easily: weight them.',
    ],
  },
];

/** The entries to show beside a channel: its own first, then the general one. */
export function guidanceFor(source: SourceId): GuidanceEntry[] {
  const own = PLACEMENT_GUIDANCE.filter((g) => g.appliesTo !== 'all' && g.appliesTo.includes(source));
  const general = PLACEMENT_GUIDANCE.filter((g) => g.appliesTo === 'all');
  return [...own, ...general];
}

export interface ChannelHint {
  code:
    | 'hi_hat_mic_type'
    | 'hi_hat_distance'
    | 'snare_bottom_low_cut'
    | 'snare_bottom_polarity'
    | 'snare_bottom_pattern'
    | 'snare_top_mic'
    | 'distance_unusual';
  message: string;
  basis: GuidanceBasis;
}

/** Soft hints for one channel; an empty list means it follows the guidance above. */
export function channelWarnings(channel: MicChannel): ChannelHint[] {
  const hints = [...sourceHints(channel)];
  if (!hints.some((h) => h.code === 'hi_hat_distance')) hints.push(...distanceHints(channel));
  return hints;
}

function sourceHints(channel: MicChannel): ChannelHint[] {
  switch (channel.source) {
    case 'hi_hat':
      return hiHatHints(channel);
    case 'snare_bottom':
      return snareBottomHints(channel);
    case 'snare_top':
      return snareTopHints(channel);
    default:
      return [];
  }
}

function hint(code: ChannelHint['code'], message: string): ChannelHint {
  return { code, message, basis: 'common practice' };
}

function hiHatHints(channel: MicChannel): ChannelHint[] {
  const hints: ChannelHint[] = [];
  if (channel.micType !== 'small_diaphragm_condenser') {
    hints.push(hint('hi_hat_mic_type', `A hi-hat is usually taken with a small-diaphragm condenser; this channel has a ${MIC_TYPE_LABELS[channel.micType].toLowerCase()}.`));
  }
  const range = COMMON_DISTANCE_RANGES_CM.hi_hat!;
  if (hasDistance(channel) && (channel.distanceCm < range.min || channel.distanceCm > range.max)) {
    hints.push(hint('hi_hat_distance', `A hi-hat mic usually sits about ${range.min}–${range.max} cm from the cymbal's edge; this one is at ${channel.distanceCm} cm.`));
  }
  return hints;
}

function snareBottomHints(channel: MicChannel): ChannelHint[] {
  const hints: ChannelHint[] = [];
  if (!channel.lowCut) {
    hints.push(hint('snare_bottom_low_cut', "Engage the low-cut on the snare bottom mic so the kick's sub-bass is not recorded."));
  }
  if (!channel.polarityInvert) {
    hints.push(hint('snare_bottom_polarity', 'The snare bottom mic faces the other way to the top mic: without the polarity switch its track will be inverted against the top and must be flipped in the mix.'));
  }
  if (channel.pattern === 'omni') {
    hints.push(hint('snare_bottom_pattern', 'An omni hears the kick fully; a figure-eight with its null toward the kick, or a cardioid turned away from it, rejects the kick.'));
  }
  return hints;
}

function snareTopHints(channel: MicChannel): ChannelHint[] {
  if (channel.micType === 'dynamic' && isCardioidFamily(channel.pattern)) return [];
  return [hint('snare_top_mic', 'A snare top is usually a dynamic cardioid with its rear null toward the toms and cymbals.')];
}

function distanceHints(channel: MicChannel): ChannelHint[] {
  const range = COMMON_DISTANCE_RANGES_CM[channel.source];
  if (!range || !hasDistance(channel)) return [];
  if (channel.distanceCm >= range.min && channel.distanceCm <= range.max) return [];
  return [
    hint('distance_unusual', `${SOURCES[channel.source].label} mics usually sit ${range.min}–${range.max} cm from the source; this one is at ${channel.distanceCm} cm.`),
  ];
}

function hasDistance(channel: MicChannel): channel is MicChannel & { distanceCm: number } {
  return typeof channel.distanceCm === 'number' && Number.isFinite(channel.distanceCm);
}
