import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RoomAcousticsView } from '@shared/schemas/rooms';
import { api } from '@/lib/api-client';
import { roomKeys } from './keys';

export async function getRoomAcoustics(id: string, signal?: AbortSignal): Promise<RoomAcousticsView> {
  return api.get<RoomAcousticsView>(`/api/rooms/${encodeURIComponent(id)}/acoustics`, { signal });
}

export function roomAcousticsQueryOptions(id: string) {
  return queryOptions({ queryKey: roomKeys.acoustics(id), queryFn: ({ signal }) => getRoomAcoustics(id, signal) });
}

export function useRoomAcoustics(id: string) {
  return useQuery(roomAcousticsQueryOptions(id));
}
