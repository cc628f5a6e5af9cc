import { channelsFromTemplate, defaultChannel, type MicChannel, type SourceId, type TemplateId } from '@shared/mic-package';
import type { MicChannelInput } from '@shared/schemas/mic-packages';

/** The pure helpers leave optional text fields out; the form and the API want every field present. */
export function toChannelInput(c: MicChannel): MicChannelInput {
  return { ...c, distanceCm: c.distanceCm ?? null, aim: c.aim ?? '', model: c.model ?? '', note: c.note ?? '' };
}

export function templateChannels(id: TemplateId): MicChannelInput[] {
  return channelsFromTemplate(id).map(toChannelInput);
}

export function newChannel(source: SourceId, number: number): MicChannelInput {
  return toChannelInput(defaultChannel(source, number));
}

/** Channel numbers follow the list order after a move, so the input list reads 1…n top to bottom. */
export function moveChannel(channels: readonly MicChannelInput[], from: number, to: number): MicChannelInput[] {
  const next = [...channels];
  const [moved] = next.splice(from, 1);
  next.splice(to, 0, moved);
  return next.map((c, i) => ({ ...c, number: i + 1 }));
}
