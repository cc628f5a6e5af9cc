import { z } from 'zod';
import { DELIVERY_DEFAULT_MAX_FILE_BYTES, DELIVERY_MAX_FILES } from '@shared/schemas/deliveries';

// The delivery feature's settings. They are read here rather than in server/env.ts so the feature stays
// in one folder; a bad value still stops the boot with a message naming the variable.
const settingsSchema = z.object({
  /** Largest stem accepted, in bytes (default 4 GiB; RF64 files may be larger when this is raised). */
  DELIVERY_MAX_FILE_BYTES: z.coerce.number().int().min(1024).default(DELIVERY_DEFAULT_MAX_FILE_BYTES),
  /** Worker threads for the delivery check (default: cores − 1, at least 1). */
  DELIVERY_CHECK_THREADS: z.coerce.number().int().min(1).max(32).optional(),
  /** Hours without a written byte after which an unfinished upload and its part are removed (default 24). */
  DELIVERY_ABANDONED_UPLOAD_HOURS: z.coerce.number().positive().max(24 * 365).default(24),
});

export type DeliverySettings = { maxFileBytes: number; maxFiles: number; checkThreads: number | undefined; abandonedUploadMs: number };

export function readDeliverySettings(source: NodeJS.ProcessEnv = process.env): DeliverySettings {
  const parsed = settingsSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid delivery settings:\n${lines.join('\n')}`);
  }
  return {
    maxFileBytes: parsed.data.DELIVERY_MAX_FILE_BYTES,
    maxFiles: DELIVERY_MAX_FILES,
    checkThreads: parsed.data.DELIVERY_CHECK_THREADS,
    abandonedUploadMs: parsed.data.DELIVERY_ABANDONED_UPLOAD_HOURS * 3_600_000,
  };
}
