import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { ReelTrackSummary } from '@shared/schemas/profiles';
import type { ReelTrackFieldsInput } from '@shared/schemas/reels';
import { ApiError } from '@/lib/api-client';
import { profileKeys } from '@/features/profiles/api/keys';

type ErrorBody = { error?: { code?: string; message?: string; fields?: Record<string, string> } };

/** fetch cannot report upload progress, so this one request uses XMLHttpRequest and its upload events. */
export function uploadReelTrack(file: File, fields: ReelTrackFieldsInput, onProgress: (fraction: number) => void): Promise<ReelTrackSummary> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/reel-tracks');
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new ApiError({ status: 0, code: 'network', message: 'The upload was interrupted. Check your connection and try again.' }));
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        body = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve((body as { track: ReelTrackSummary }).track);
      const error = (body as ErrorBody | null)?.error;
      reject(
        new ApiError({
          status: xhr.status,
          code: error?.code ?? `http_${xhr.status}`,
          message: error?.message ?? `The upload failed (${xhr.status}). Please try again.`,
          fields: error?.fields,
        }),
      );
    };
    const form = new FormData();
    form.append('title', fields.title);
    if (fields.style) form.append('style', fields.style);
    if (fields.tempo !== undefined) form.append('tempo', String(fields.tempo));
    // The file goes last so the text fields are parsed before the large part streams in.
    form.append('file', file);
    xhr.send(form);
  });
}

export function useUploadReelTrack() {
  const queryClient = useQueryClient();
  const [progress, setProgress] = useState(0);
  const mutation = useMutation({
    mutationFn: ({ file, fields }: { file: File; fields: ReelTrackFieldsInput }) => {
      setProgress(0);
      return uploadReelTrack(file, fields, setProgress);
    },
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: profileKeys.all }),
  });
  return { ...mutation, progress };
}
