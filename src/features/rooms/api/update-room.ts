import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RoomUpdateInput, RoomView } from '@shared/schemas/rooms';
import { api } from '@/lib/api-client';
import { roomKeys } from './keys';
import { roomQueryOptions } from './get-room';
import { roomAcousticsQueryOptions } from './get-room-acoustics';

export async function updateRoom({ id, input }: { id: string; input: RoomUpdateInput }): Promise<RoomView> {
  return (await api.patch<{ room: RoomView }>(`/api/rooms/${encodeURIComponent(id)}`, input)).room;
}

export function useUpdateRoom() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateRoom,
    onSuccess: (room) => {
      queryClient.setQueryData(roomQueryOptions(room.id).queryKey, room);
      void queryClient.invalidateQueries({ queryKey: roomAcousticsQueryOptions(room.id).queryKey });
      void queryClient.invalidateQueries({ queryKey: roomKeys.mine() });
    },
  });
}
