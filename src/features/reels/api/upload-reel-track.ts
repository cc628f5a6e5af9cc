import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { ReelTrackSummary } from '@shared/schemas/profiles';
import type { ReelTrackFieldsInput } from '@shared/schemas/reels';
import { postForm } from '@/lib/post-form';
import { profileKeys } from '@/features/profiles/api/keys';

/** A reel track as multipart, with upload progress. */
export async function uploadReelTrack(file: File, fields: ReelTrackFieldsInput, onProgress: (fraction: number) => void): Promise<ReelTrackSummary> {
  const form = new FormData();
  form.append('title', fields.title);
  if (fields.style) form.append('style', fields.style);
  if (fields.tempo !== undefined) form.append('tempo', String(fields.tempo));
  // The file goes last so the text fields are parsed before the large part streams in.
  form.append('file', file);
  const { track } = await postForm<{ track: ReelTrackSummary }>('/api/reel-tracks', form, { onProgress });
  return track;
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
