import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { BriefView } from '@shared/schemas/briefs';
import { ApiError } from '@/lib/api-client';
import { briefKeys } from './keys';
import { briefQueryOptions } from './get-brief';

type ErrorBody = { error?: { code?: string; message?: string; fields?: Record<string, string> } };

/**
 * Multipart upload with progress. fetch cannot report upload progress, so this one request uses
 * XMLHttpRequest; its errors are turned into the same ApiError the api client throws.
 */
export function uploadGuide(id: string, file: File, onProgress: (fraction: number) => void): Promise<BriefView> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/briefs/${encodeURIComponent(id)}/guide`);
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
      if (xhr.status >= 200 && xhr.status < 300) return resolve((body as { brief: BriefView }).brief);
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
    form.append('file', file);
    xhr.send(form);
  });
}

export function useUploadGuide(id: string) {
  const queryClient = useQueryClient();
  const [progress, setProgress] = useState(0);
  const mutation = useMutation({
    mutationFn: (file: File) => {
      setProgress(0);
      return uploadGuide(id, file, setProgress);
    },
    onSuccess: (brief) => {
      queryClient.setQueryData(briefQueryOptions(brief.id).queryKey, brief);
      void queryClient.invalidateQueries({ queryKey: briefKeys.peaks(brief.id) });
    },
  });
  return { ...mutation, progress };
}
