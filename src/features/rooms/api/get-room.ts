import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RoomView } from '@shared/schemas/rooms';
import { api } from '@/lib/api-client';
import { roomKeys } from './keys';

export async function getRoom(id: string, signal?: AbortSignal): Promise<RoomView> {
  return (await api.get<{ room: RoomView }>(`/api/rooms/${encodeURIComponent(id)}`, { signal })).room;
}

export function roomQueryOptions(id: string) {
  return queryOptions({ queryKey: roomKeys.detail(id), queryFn: ({ signal }) => getRoom(id, signal) });
}

export function useRoom(id: string) {
  return useQuery({ ...roomQueryOptions(id), enabled: id !== '' });
}
