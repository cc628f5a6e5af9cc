import { z } from 'zod';
import { DRUM_STYLES } from './profiles';

// Reel tracks: short recordings a drummer shows on the profile. The file arrives as multipart; these are
// its text fields, checked the same way in the upload form and on the server.

export const REEL_MAX_BYTES = 40 * 1024 * 1024;
export const REEL_MAX_TRACKS = 8;
export const REEL_ACCEPT = 'audio/wav,audio/x-wav,audio/wave,audio/mpeg,.wav,.mp3';

const emptyToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);

export const reelTrackFieldsInputSchema = z.object({
  title: z.string().trim().min(1, 'Give the track a title').max(100, 'Keep the title under 100 characters'),
  style: z.preprocess(emptyToUndefined, z.enum(DRUM_STYLES, 'Pick a style from the list').optional()),
  // Multipart fields are strings; the form sends a number.
  tempo: z.preprocess(
    emptyToUndefined,
    z.coerce.number('Enter the tempo in BPM').int('Whole BPM').min(20, 'At least 20 BPM').max(300, 'At most 300 BPM').optional(),
  ),
});
export type ReelTrackFieldsInput = z.infer<typeof reelTrackFieldsInputSchema>;
export type ReelTrackFieldsFormValues = z.input<typeof reelTrackFieldsInputSchema>;

export const reelOrderInputSchema = z.strictObject({
  ids: z.array(z.string().min(1).max(64)).max(50),
});
export type ReelOrderInput = z.infer<typeof reelOrderInputSchema>;

export const reelAudioPath = (id: string) => `/api/reel-tracks/${encodeURIComponent(id)}/audio`;
export const reelPeaksPath = (id: string) => `/api/reel-tracks/${encodeURIComponent(id)}/peaks`;
