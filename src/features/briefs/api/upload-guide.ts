import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import type { BriefView } from '@shared/schemas/briefs';
import { postForm } from '@/lib/post-form';
import { briefKeys } from './keys';
import { briefQueryOptions } from './get-brief';

/** The guide track as multipart, with upload progress. */
export async function uploadGuide(id: string, file: File, onProgress: (fraction: number) => void): Promise<BriefView> {
  const form = new FormData();
  form.append('file', file);
  const { brief } = await postForm<{ brief: BriefView }>(`/api/briefs/${encodeURIComponent(id)}/guide`, form, { onProgress });
  return brief;
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
