import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RoomView } from '@shared/schemas/rooms';
import { api } from '@/lib/api-client';
import { roomQueryOptions } from './get-room';

export async function setBlockedDates({ id, dates }: { id: string; dates: string[] }): Promise<string[]> {
  return (await api.put<{ blockedDates: string[] }>(`/api/rooms/${encodeURIComponent(id)}/blocked-dates`, { dates })).blockedDates;
}

export function useSetBlockedDates(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (dates: string[]) => setBlockedDates({ id, dates }),
    onSuccess: (blockedDates) => {
      queryClient.setQueryData(roomQueryOptions(id).queryKey, (room: RoomView | undefined) => (room ? { ...room, blockedDates } : room));
    },
  });
}
