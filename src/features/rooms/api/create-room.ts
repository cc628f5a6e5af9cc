import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RoomInput, RoomView } from '@shared/schemas/rooms';
import { api } from '@/lib/api-client';
import { roomKeys } from './keys';
import { roomQueryOptions } from './get-room';

export async function createRoom(input: RoomInput): Promise<RoomView> {
  return (await api.post<{ room: RoomView }>('/api/rooms', input)).room;
}

export function useCreateRoom() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createRoom,
    onSuccess: (room) => {
      queryClient.setQueryData(roomQueryOptions(room.id).queryKey, room);
      void queryClient.invalidateQueries({ queryKey: roomKeys.mine() });
    },
  });
}
