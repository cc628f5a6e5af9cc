// Input lists an engineer can start from (4, 8 and 12 channels). The defaults are plausible common
// practice for a rock/pop kit, not a recommendation for a particular room; the engineer edits them.

import type { MicChannel, SourceId } from './sources';

/**
 * Usual capsule-to-source distances in cm (common practice). The hi-hat range is the one stated in issue 6;
 * the others are the ranges usually quoted in recording guides, from memory. Used to check the templates and
 * to give soft hints, never to refuse input.
 */
export const COMMON_DISTANCE_RANGES_CM: Readonly<Partial<Record<SourceId, { min: number; max: number }>>> = {
  kick_in: { min: 5, max: 30 },
  kick_out: { min: 5, max: 60 },
  snare_top: { min: 2, max: 10 },
  snare_bottom: { min: 2, max: 10 },
  hi_hat: { min: 15, max: 20 },
  rack_tom_1: { min: 2, max: 10 },
  rack_tom_2: { min: 2, max: 10 },
  rack_tom_3: { min: 2, max: 10 },
  floor_tom_1: { min: 2, max: 10 },
  floor_tom_2: { min: 2, max: 10 },
  overhead_l: { min: 60, max: 150 },
  overhead_r: { min: 60, max: 150 },
  room_l: { min: 150, max: 1000 },
  room_r: { min: 150, max: 1000 },
  room_mono: { min: 100, max: 600 },
};

export const TEMPLATE_IDS = ['four_channel', 'eight_channel', 'twelve_channel'] as const;
export type TemplateId = (typeof TEMPLATE_IDS)[number];

export interface PackageTemplate {
  id: TemplateId;
  label: string;
  description: string;
  channels: readonly MicChannel[];
}

type ChannelDefaults = Omit<MicChannel, 'number'>;

const DEFAULTS: Readonly<Record<Exclude<SourceId, 'other'>, ChannelDefaults>> = {
  kick_in: { source: 'kick_in', micType: 'dynamic', pattern: 'cardioid', distanceCm: 15, aim: 'Inside the drum, toward the beater, a little off-centre', lowCut: false, polarityInvert: false },
  kick_out: { source: 'kick_out', micType: 'large_diaphragm_condenser', pattern: 'cardioid', distanceCm: 20, aim: 'Outside the resonant head, toward its centre', lowCut: false, polarityInvert: false },
  snare_top: { source: 'snare_top', micType: 'dynamic', pattern: 'cardioid', distanceCm: 4, aim: 'Over the rim toward the centre, rear toward the hi-hat and toms', lowCut: false, polarityInvert: false },
  // Facing the other way to the top mic: flipped at the preamp so the two add up, low-cut against the kick.
  snare_bottom: { source: 'snare_bottom', micType: 'dynamic', pattern: 'cardioid', distanceCm: 5, aim: 'Up at the snare wires, turned away from the kick', lowCut: true, polarityInvert: true },
  hi_hat: { source: 'hi_hat', micType: 'small_diaphragm_condenser', pattern: 'cardioid', distanceCm: 18, aim: "Toward the cymbal's outer edge, away from the snare and out of the air from the closing hats", lowCut: true, polarityInvert: false },
  rack_tom_1: { source: 'rack_tom_1', micType: 'dynamic', pattern: 'cardioid', distanceCm: 5, aim: 'Over the rim toward the centre', lowCut: false, polarityInvert: false },
  rack_tom_2: { source: 'rack_tom_2', micType: 'dynamic', pattern: 'cardioid', distanceCm: 5, aim: 'Over the rim toward the centre', lowCut: false, polarityInvert: false },
  rack_tom_3: { source: 'rack_tom_3', micType: 'dynamic', pattern: 'cardioid', distanceCm: 5, aim: 'Over the rim toward the centre', lowCut: false, polarityInvert: false },
  floor_tom_1: { source: 'floor_tom_1', micType: 'dynamic', pattern: 'cardioid', distanceCm: 5, aim: 'Over the rim toward the centre', lowCut: false, polarityInvert: false },
  floor_tom_2: { source: 'floor_tom_2', micType: 'dynamic', pattern: 'cardioid', distanceCm: 5, aim: 'Over the rim toward the centre', lowCut: false, polarityInvert: false },
  overhead_l: { source: 'overhead_l', micType: 'small_diaphragm_condenser', pattern: 'cardioid', distanceCm: 100, aim: 'Down at the kit, the same distance from the snare as the right overhead', lowCut: false, polarityInvert: false },
  overhead_r: { source: 'overhead_r', micType: 'small_diaphragm_condenser', pattern: 'cardioid', distanceCm: 100, aim: 'Down at the kit, the same distance from the snare as the left overhead', lowCut: false, polarityInvert: false },
  room_l: { source: 'room_l', micType: 'large_diaphragm_condenser', pattern: 'omni', distanceCm: 300, aim: 'At the kit from the front left', lowCut: false, polarityInvert: false },
  room_r: { source: 'room_r', micType: 'large_diaphragm_condenser', pattern: 'omni', distanceCm: 300, aim: 'At the kit from the front right', lowCut: false, polarityInvert: false },
  room_mono: { source: 'room_mono', micType: 'ribbon', pattern: 'figure_eight', distanceCm: 150, aim: 'At the kit from the front, at chest height', lowCut: false, polarityInvert: false },
};

const TEMPLATE_SOURCES: Readonly<Record<TemplateId, readonly Exclude<SourceId, 'other'>[]>> = {
  four_channel: ['kick_in', 'snare_top', 'overhead_l', 'overhead_r'],
  eight_channel: ['kick_in', 'snare_top', 'snare_bottom', 'hi_hat', 'rack_tom_1', 'floor_tom_1', 'overhead_l', 'overhead_r'],
  twelve_channel: [
    'kick_in',
    'kick_out',
    'snare_top',
    'snare_bottom',
    'hi_hat',
    'rack_tom_1',
    'rack_tom_2',
    'floor_tom_1',
    'overhead_l',
    'overhead_r',
    'room_l',
    'room_r',
  ],
};

const TEMPLATE_TEXT: Readonly<Record<TemplateId, { label: string; description: string }>> = {
  four_channel: { label: '4 channels', description: 'Kick, snare and a pair of overheads: the kit as a whole, with the two drums that carry the groove.' },
  eight_channel: { label: '8 channels', description: 'Close mics on kick, snare (top and bottom), hi-hat and two toms, plus overheads.' },
  twelve_channel: { label: '12 channels', description: 'Kick in and out, snare top and bottom, hi-hat, three toms, overheads and a room pair.' },
};

/** A fresh, numbered copy of a template's channels, ready to edit. */
export function channelsFromTemplate(id: TemplateId): MicChannel[] {
  return TEMPLATE_SOURCES[id].map((source, i) => defaultChannel(source, i + 1));
}

export function getTemplate(id: TemplateId): PackageTemplate {
  return { id, ...TEMPLATE_TEXT[id], channels: channelsFromTemplate(id) };
}

export function listTemplates(): PackageTemplate[] {
  return TEMPLATE_IDS.map(getTemplate);
}

/** The default settings for one source, e.g. when an engineer adds a channel; "other" starts as a plain dynamic. */
export function defaultChannel(source: SourceId, number: number): MicChannel {
  if (source === 'other') {
    return { number, source, micType: 'dynamic', pattern: 'cardioid', distanceCm: null, aim: '', lowCut: false, polarityInvert: false, model: '', note: '' };
  }
  return { number, ...DEFAULTS[source], model: '', note: '' };
}
