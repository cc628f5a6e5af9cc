import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { roomQueryOptions } from './get-room';

export async function deleteRoomPhoto({ id, photoId }: { id: string; photoId: string }): Promise<void> {
  await api.delete<null>(`/api/rooms/${encodeURIComponent(id)}/photos/${encodeURIComponent(photoId)}`);
}

export function useDeleteRoomPhoto(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (photoId: string) => deleteRoomPhoto({ id, photoId }),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: roomQueryOptions(id).queryKey }),
  });
}
