import { z } from 'zod';
import { PART_IDS } from '../stems/parts';
import type { DeliveryCheckReport, WaveformPeaks } from './delivery-check';

// Stem deliveries (issue 5): a numbered set of WAV stems for one booking, uploaded resumably (tus), checked
// by a background job, reviewed in the browser. One schema per request body, used by the forms and routes.

/** Kitlane's limits for one delivery (DESIGN.md: typically 8–16 files; 32 leaves room for doubled mics). */
export const DELIVERY_MAX_FILES = 32;
/** The default per-file limit; the server's DELIVERY_MAX_FILE_BYTES setting may lower or raise it. */
export const DELIVERY_DEFAULT_MAX_FILE_BYTES = 4 * 1024 ** 3;
export const DELIVERY_NOTE_MAX = 2000;
export const DELIVERY_ACCEPT = 'audio/wav,audio/x-wav,audio/wave,.wav,.wave,.bwf';

export const DELIVERY_STATUSES = ['uploading', 'checking', 'ready'] as const;
export type DeliveryStatus = (typeof DELIVERY_STATUSES)[number];
export const DELIVERY_STATUS_LABELS: Record<DeliveryStatus, string> = { uploading: 'Uploading', checking: 'Checking', ready: 'Ready' };

export const DELIVERY_DECISIONS = ['changes_requested', 'accepted'] as const;
export type DeliveryDecision = (typeof DELIVERY_DECISIONS)[number];

export const partIdSchema = z.enum(PART_IDS, { error: 'Choose a part from the list' });

export const deliveryInputSchema = z.strictObject({
  note: z.string().trim().max(DELIVERY_NOTE_MAX, `Keep the note under ${DELIVERY_NOTE_MAX} characters`).default(''),
});
export type DeliveryInput = z.infer<typeof deliveryInputSchema>;

/** A WAV file name as the uploader's computer had it: no paths, no control characters. */
export const stemFileNameSchema = z
  .string()
  .trim()
  .min(1, 'The file needs a name')
  .max(200, 'Keep file names under 200 characters')
  // eslint-disable-next-line no-control-regex
  .refine((n) => !/[\u0000-\u001f\u007f/\\]/.test(n), 'File names cannot contain slashes or control characters')
  .refine((n) => /\.(wav|wave|bwf)$/i.test(n), 'Only WAV files (.wav) are delivered');

export const deliveryFileInputSchema = z.strictObject({
  name: stemFileNameSchema,
  sizeBytes: z.number().int('Sizes are whole bytes').min(1, 'The file is empty'),
  part: partIdSchema.nullable().default(null),
});
export type DeliveryFileInput = z.infer<typeof deliveryFileInputSchema>;

export const deliveryFileUpdateInputSchema = z.strictObject({ part: partIdSchema.nullable() });
export type DeliveryFileUpdateInput = z.infer<typeof deliveryFileUpdateInputSchema>;

export const deliveryNoteInputSchema = z.strictObject({
  atSec: z.number({ error: 'Pick a point on the timeline' }).min(0, 'The time cannot be negative').max(24 * 3600, 'That is beyond the end'),
  fileId: z.string().min(1).max(64).nullable().default(null),
  body: z.string().trim().min(1, 'Write what should change here').max(1000, 'Keep a note under 1000 characters'),
});
export type DeliveryNoteInput = z.infer<typeof deliveryNoteInputSchema>;

export const requestChangesInputSchema = z.strictObject({
  message: z.string().trim().max(DELIVERY_NOTE_MAX, `Keep the message under ${DELIVERY_NOTE_MAX} characters`).default(''),
});
export type RequestChangesInput = z.infer<typeof requestChangesInputSchema>;

// ---- Response shapes ----

export type DeliveryFileStatus = 'uploading' | 'uploaded';
export type PreviewStatus = 'pending' | 'ready' | 'failed';

export type DeliveryFileView = {
  id: string;
  name: string;
  part: string | null;
  /** The part the file name suggests (shared/stems/parts.ts), shown when the uploader has not chosen one. */
  suggestedPart: string | null;
  sizeBytes: number;
  status: DeliveryFileStatus;
  /** Hex SHA-256 of the original, computed while it streamed in; null until the upload is complete. */
  sha256: string | null;
  previewStatus: PreviewStatus;
  hasPeaks: boolean;
  position: number;
  uploadedAt: string | null;
};

export type DeliveryNoteView = {
  id: string;
  atSec: number;
  fileId: string | null;
  body: string;
  author: { id: string; displayName: string };
  /** When the note went to the drummer with a request for changes; null while still a draft. */
  requestedAt: string | null;
  createdAt: string;
};

export type DeliveryCheckView = {
  status: 'waiting' | 'running' | 'done' | 'failed';
  progress: number;
  label: string;
  error: string | null;
  report: DeliveryCheckReport | null;
};

export type DeliveryView = {
  id: string;
  bookingId: string;
  number: number;
  status: DeliveryStatus;
  note: string;
  decision: DeliveryDecision | null;
  submittedAt: string | null;
  decidedAt: string | null;
  createdAt: string;
  createdBy: { id: string; displayName: string };
  files: DeliveryFileView[];
  check: DeliveryCheckView;
  notes: DeliveryNoteView[];
  /** Originals download for this reader (the songwriter only after acceptance or an admin's release). */
  originalsUnlocked: boolean;
  can: {
    upload: boolean;
    submit: boolean;
    note: boolean;
    requestChanges: boolean;
    accept: boolean;
    downloadOriginals: boolean;
  };
  /** Why submit is not possible yet, in words; null when it is. */
  submitBlockedBy: string | null;
  maxFileBytes: number;
  maxFiles: number;
};

export type DeliveryListView = {
  items: DeliveryView[];
  /** Whether the reader may start a new delivery now, and if not, why. */
  canCreate: boolean;
  createBlockedBy: string | null;
  /** Stem names and parts the booking's mic package suggests (empty without a package). */
  inputList: { number: number; part: string; label: string }[];
};

export type RequestChangesResult = { delivery: DeliveryView; addOnsOutstanding: number };

export type DeliveryManifest = {
  booking: { id: string; songTitle: string };
  delivery: { id: string; number: number; submittedAt: string | null };
  files: { name: string; part: string | null; sizeBytes: number; sha256: string; format: string | null; sampleRate: number | null; bitDepth: number | null; channels: number | null; durationSec: number | null }[];
  check: { summary: string | null; level: string | null };
};

export type { DeliveryCheckReport, WaveformPeaks };

// ---- Paths (one place for the client and the tests) ----

const enc = encodeURIComponent;
export const deliveryPaths = {
  list: (bookingId: string) => `/api/bookings/${enc(bookingId)}/deliveries`,
  one: (id: string) => `/api/deliveries/${enc(id)}`,
  files: (id: string) => `/api/deliveries/${enc(id)}/files`,
  file: (id: string, fileId: string) => `/api/deliveries/${enc(id)}/files/${enc(fileId)}`,
  preview: (id: string, fileId: string) => `/api/deliveries/${enc(id)}/files/${enc(fileId)}/preview`,
  peaks: (id: string, fileId: string) => `/api/deliveries/${enc(id)}/files/${enc(fileId)}/peaks`,
  original: (id: string, fileId: string) => `/api/deliveries/${enc(id)}/files/${enc(fileId)}/original`,
  zip: (id: string) => `/api/deliveries/${enc(id)}/zip`,
  submit: (id: string) => `/api/deliveries/${enc(id)}/submit`,
  notes: (id: string) => `/api/deliveries/${enc(id)}/notes`,
  note: (id: string, noteId: string) => `/api/deliveries/${enc(id)}/notes/${enc(noteId)}`,
  requestChanges: (id: string) => `/api/deliveries/${enc(id)}/request-changes`,
  accept: (id: string) => `/api/deliveries/${enc(id)}/accept`,
  /** The tus endpoint (creation, resumable PATCH, HEAD for the offset, DELETE to cancel). */
  uploads: '/api/uploads',
};
