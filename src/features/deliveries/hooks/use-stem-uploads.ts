import { useCallback, useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Upload } from 'tus-js-client';
import { deliveryPaths } from '@shared/schemas/deliveries';
import type { PartId } from '@shared/stems/parts';
import { deliveryQueryOptions } from '../api/get-delivery';
import { addDeliveryFile, removeDeliveryFile } from '../api/delivery-files';

// Resumable stem uploads with tus-js-client (docs/decisions/011-resumable-uploads.md). Each file gets a row
// on the delivery first; its id is the tus upload id. The client remembers the upload URL (local storage,
// keyed by that id), so after a dropped connection, a pause or a reload it asks the server for the offset
// (HEAD) and sends only the rest.

export type UploadPhase = 'starting' | 'uploading' | 'paused' | 'retrying' | 'done' | 'failed';
export type UploadState = { fileId: string; name: string; phase: UploadPhase; sent: number; total: number; bytesPerSecond: number; error: string | null };

const CHUNK_BYTES = 8 * 1024 * 1024;
const SPEED_WINDOW_MS = 2000;

export function useStemUploads(deliveryId: string) {
  const qc = useQueryClient();
  const uploads = useRef(new Map<string, Upload>());
  const samples = useRef(new Map<string, { t: number; sent: number }[]>());
  const [states, setStates] = useState<Record<string, UploadState>>({});

  const patch = useCallback((fileId: string, values: Partial<UploadState>) => {
    setStates((all) => (all[fileId] ? { ...all, [fileId]: { ...all[fileId], ...values } } : all));
  }, []);
  const refresh = useCallback(() => void qc.invalidateQueries({ queryKey: deliveryQueryOptions(deliveryId).queryKey }), [qc, deliveryId]);

  /** Bytes per second over the last two seconds of progress events. */
  const speedOf = useCallback((fileId: string, sent: number) => {
    const now = performance.now();
    const list = (samples.current.get(fileId) ?? []).filter((s) => now - s.t < SPEED_WINDOW_MS);
    list.push({ t: now, sent });
    samples.current.set(fileId, list);
    const first = list[0];
    return now - first.t > 100 ? ((sent - first.sent) * 1000) / (now - first.t) : 0;
  }, []);

  const begin = useCallback(
    (fileId: string, file: File) => {
      const upload = new Upload(file, {
        endpoint: deliveryPaths.uploads,
        metadata: { fileId, filename: file.name },
        chunkSize: CHUNK_BYTES,
        // A dropped connection is retried with growing pauses; each retry resumes from the server's offset.
        retryDelays: [500, 1000, 2000, 4000, 8000, 15000],
        fingerprint: async () => `kitlane-delivery-file:${fileId}`,
        storeFingerprintForResuming: true,
        removeFingerprintOnSuccess: true,
        onProgress: (sent, total) => patch(fileId, { phase: 'uploading', sent, total, bytesPerSecond: speedOf(fileId, sent), error: null }),
        onShouldRetry: (error, attempt) => {
          const status = error.originalResponse?.getStatus() ?? 0;
          // 4xx other than conflicts and locks will not change on retry.
          const retry = status === 0 || status === 409 || status === 423 || status >= 500;
          if (retry) patch(fileId, { phase: 'retrying', error: `Connection lost; retrying (${attempt + 1})…`, bytesPerSecond: 0 });
          return retry;
        },
        onError: (error) => patch(fileId, { phase: 'failed', error: readableError(error), bytesPerSecond: 0 }),
        onSuccess: () => {
          patch(fileId, { phase: 'done', bytesPerSecond: 0, error: null });
          refresh();
        },
      });
      uploads.current.set(fileId, upload);
      void upload.findPreviousUploads().then((previous) => {
        if (previous[0]) upload.resumeFromPreviousUpload(previous[0]);
        upload.start();
      });
    },
    [patch, refresh, speedOf],
  );

  const files = useRef(new Map<string, File>());

  /** Starts a new file, or with `existingFileId` picks up a file whose upload an earlier visit left unfinished. */
  const add = useCallback(
    async (file: File, part: PartId | null, existingFileId?: string): Promise<void> => {
      const id = existingFileId ?? (await addDeliveryFile(deliveryId, { name: file.name, sizeBytes: file.size, part })).id;
      files.current.set(id, file);
      setStates((all) => ({ ...all, [id]: { fileId: id, name: file.name, phase: 'starting', sent: 0, total: file.size, bytesPerSecond: 0, error: null } }));
      refresh();
      begin(id, file);
    },
    [deliveryId, begin, refresh],
  );

  const pause = useCallback(
    (fileId: string) => {
      void uploads.current.get(fileId)?.abort();
      patch(fileId, { phase: 'paused', bytesPerSecond: 0 });
    },
    [patch],
  );

  /** After a pause or a failure: the same upload continues from what the server already has. */
  const resume = useCallback(
    (fileId: string) => {
      const file = files.current.get(fileId);
      if (!file) return;
      samples.current.delete(fileId);
      patch(fileId, { phase: 'uploading', error: null });
      begin(fileId, file);
    },
    [begin, patch],
  );

  const cancel = useCallback(
    async (fileId: string) => {
      await uploads.current.get(fileId)?.abort();
      uploads.current.delete(fileId);
      files.current.delete(fileId);
      await removeDeliveryFile(deliveryId, fileId);
      setStates((all) => {
        const rest = { ...all };
        delete rest[fileId];
        return rest;
      });
      refresh();
    },
    [deliveryId, refresh],
  );

  // Leaving the page stops sending; the stored URL lets the next visit resume.
  useEffect(() => {
    const live = uploads.current;
    return () => {
      for (const u of live.values()) void u.abort();
    };
  }, []);

  return { states, add, pause, resume, cancel, canResume: (fileId: string) => files.current.has(fileId) };
}

function readableError(error: Error): string {
  const body = (error as { originalResponse?: { getBody(): string } | null }).originalResponse?.getBody();
  if (body) {
    try {
      const parsed = JSON.parse(body) as { error?: { message?: string } };
      if (parsed.error?.message) return parsed.error.message;
    } catch {
      // A plain-text tus error: fall through.
    }
  }
  return 'The upload stopped. Retry to continue from where it stopped.';
}
