import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RoomPhotoView } from '@shared/schemas/rooms';
import { ApiError } from '@/lib/api-client';
import { roomKeys } from './keys';
import { roomQueryOptions } from './get-room';

type ErrorBody = { error?: { code?: string; message?: string; fields?: Record<string, string> } };

/** Multipart upload; the api client speaks JSON only, so this one request uses fetch with FormData directly. */
export async function uploadRoomPhoto({ id, file, caption }: { id: string; file: File; caption: string }): Promise<RoomPhotoView> {
  const form = new FormData();
  form.append('caption', caption);
  form.append('file', file);
  let response: Response;
  try {
    response = await fetch(`/api/rooms/${encodeURIComponent(id)}/photos`, { method: 'POST', body: form, credentials: 'same-origin', headers: { Accept: 'application/json' } });
  } catch {
    throw new ApiError({ status: 0, code: 'network', message: 'The upload was interrupted. Check your connection and try again.' });
  }
  const body = (await response.json().catch(() => null)) as ({ photo: RoomPhotoView } & ErrorBody) | null;
  if (response.ok && body?.photo) return body.photo;
  throw new ApiError({
    status: response.status,
    code: body?.error?.code ?? `http_${response.status}`,
    message: body?.error?.message ?? `The upload failed (${response.status}). Please try again.`,
    fields: body?.error?.fields,
  });
}

export function useUploadRoomPhoto(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (v: { file: File; caption: string }) => uploadRoomPhoto({ id, ...v }),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: roomQueryOptions(id).queryKey });
      void queryClient.invalidateQueries({ queryKey: roomKeys.mine() });
    },
  });
}
