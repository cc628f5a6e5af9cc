// Creating and updating a mic package (an engineer's input list). One schema for the form and the server.
// A package belongs to a room and cannot use more channels than the room has inputs: that rule needs the
// room, so it lives in validatePackageAgainstRoom / micPackageInputSchemaForRoom.

import { z } from 'zod';
import { MIC_TYPES, POLAR_PATTERNS, SOURCE_IDS } from '../mic-package/sources';
import type { DeliveryExpectPair, PackagePair } from '../mic-package/pairs';
import { MAX_AMOUNT_MINOR, ROOM_INPUT_LIMITS } from './rooms';

export const CHANNEL_DISTANCE_LIMITS_CM = { min: 0.5, max: 1000 } as const;

export const micChannelInputSchema = z.object({
  number: z
    .number({ error: 'Enter the channel number' })
    .int('Channel numbers are whole numbers')
    .min(1, 'Channels start at 1')
    .max(ROOM_INPUT_LIMITS.max, `At most ${ROOM_INPUT_LIMITS.max}`),
  source: z.enum(SOURCE_IDS, { error: 'Choose what this channel picks up' }),
  micType: z.enum(MIC_TYPES, { error: 'Choose the type of microphone' }),
  pattern: z.enum(POLAR_PATTERNS, { error: 'Choose the polar pattern' }),
  distanceCm: z
    .number({ error: 'Enter the distance in cm' })
    .min(CHANNEL_DISTANCE_LIMITS_CM.min, `At least ${CHANNEL_DISTANCE_LIMITS_CM.min} cm`)
    .max(CHANNEL_DISTANCE_LIMITS_CM.max, `At most ${CHANNEL_DISTANCE_LIMITS_CM.max} cm`)
    .nullable()
    .default(null),
  aim: z.string().trim().max(200, 'Keep the aim under 200 characters').default(''),
  lowCut: z.boolean(),
  polarityInvert: z.boolean(),
  /** Free text: the engineer's own name for the microphone. */
  model: z.string().trim().max(80, 'Keep the model name under 80 characters').default(''),
  note: z.string().trim().max(500, 'Keep the note under 500 characters').default(''),
});
export type MicChannelInput = z.infer<typeof micChannelInputSchema>;

const packageFields = {
  name: z.string().trim().min(1, 'Give the package a name').max(120, 'Keep the name under 120 characters'),
  priceMinor: z
    .number({ error: 'Enter a price' })
    .int('Amounts are whole numbers of the smallest currency unit')
    .min(0, 'The price cannot be negative')
    .max(MAX_AMOUNT_MINOR, 'The price is too large'),
  currency: z.string().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code such as EUR'),
  channels: z
    .array(micChannelInputSchema)
    .min(1, 'Add at least one channel')
    .max(ROOM_INPUT_LIMITS.max, `At most ${ROOM_INPUT_LIMITS.max} channels`),
};

type IssueSink = { addIssue: (issue: { code: 'custom'; path: PropertyKey[]; message: string }) => void };

function addDuplicateNumberIssues(channels: readonly { number: number }[], ctx: IssueSink): void {
  const seen = new Set<number>();
  channels.forEach((ch, i) => {
    if (seen.has(ch.number)) ctx.addIssue({ code: 'custom', path: ['channels', i, 'number'], message: `Channel ${ch.number} is used twice` });
    seen.add(ch.number);
  });
}

export const micPackageInputSchema = z.object(packageFields).superRefine((pkg, ctx) => addDuplicateNumberIssues(pkg.channels, ctx));
export type MicPackageInput = z.infer<typeof micPackageInputSchema>;

/** A partial update; the service merges it into the stored package and checks it against the room again. */
export const micPackageUpdateInputSchema = z
  .object(packageFields)
  .partial()
  .superRefine((pkg, ctx) => {
    if (pkg.channels) addDuplicateNumberIssues(pkg.channels, ctx);
  });
export type MicPackageUpdateInput = z.infer<typeof micPackageUpdateInputSchema>;

export interface FieldIssue {
  path: (string | number)[];
  message: string;
}

/** Room rules for a package: no more channels than inputs, and no channel number beyond the last input. */
export function validatePackageAgainstRoom(pkg: { channels: readonly { number: number }[] }, room: { inputs: number }): FieldIssue[] {
  const issues: FieldIssue[] = [];
  if (pkg.channels.length > room.inputs) {
    issues.push({
      path: ['channels'],
      message: `This package has ${pkg.channels.length} channels but the room has ${room.inputs} inputs`,
    });
  }
  pkg.channels.forEach((ch, i) => {
    if (ch.number > room.inputs) {
      issues.push({ path: ['channels', i, 'number'], message: `The room has inputs 1–${room.inputs}; there is no input ${ch.number}` });
    }
  });
  return issues;
}

/** micPackageInputSchema plus the room's rules, for a form or route that knows the room. */
export function micPackageInputSchemaForRoom(room: { inputs: number }) {
  return micPackageInputSchema.superRefine((pkg, ctx) => {
    for (const issue of validatePackageAgainstRoom(pkg, room)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
  });
}

// ---- Response shapes ----

export type MicPackageView = {
  id: string;
  roomId: string;
  roomName: string;
  roomTown: string;
  roomInputs: number;
  engineerId: string;
  engineerName: string;
  name: string;
  priceMinor: number;
  currency: string;
  channels: MicChannelInput[];
  /** Related channels and the polarity the delivery check should expect between their stems. */
  pairs: PackagePair[];
  /** Removed by the engineer: still readable from quotes and bookings that name it, no longer offered. */
  archived: boolean;
  mine: boolean;
  createdAt: string;
  updatedAt: string;
};

export type MicPackageList = { items: MicPackageView[]; total: number };

/**
 * What a booking keeps of the package its quote named (`bookings.inputList`), frozen at acceptance:
 * the delivery check reads `checkPairs` (part ids = source ids) and the upload form pre-fills stem names
 * from `channels`.
 */
export type BookingInputList = {
  packageId: string;
  packageName: string;
  roomId: string;
  roomName: string;
  channels: MicChannelInput[];
  pairs: PackagePair[];
  checkPairs: DeliveryExpectPair[];
};
