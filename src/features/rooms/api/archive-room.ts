import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { roomKeys } from './keys';

export async function archiveRoom(id: string): Promise<void> {
  await api.delete<null>(`/api/rooms/${encodeURIComponent(id)}`);
}

export function useArchiveRoom() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: archiveRoom, onSuccess: () => void queryClient.invalidateQueries({ queryKey: roomKeys.all }) });
}
