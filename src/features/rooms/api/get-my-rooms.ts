import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RoomSummary } from '@shared/schemas/rooms';
import { api } from '@/lib/api-client';
import { roomKeys } from './keys';

export async function getMyRooms(signal?: AbortSignal): Promise<{ items: RoomSummary[]; total: number }> {
  return api.get<{ items: RoomSummary[]; total: number }>('/api/rooms/mine', { signal });
}

export function myRoomsQueryOptions() {
  return queryOptions({ queryKey: roomKeys.mine(), queryFn: ({ signal }) => getMyRooms(signal) });
}

export function useMyRooms() {
  return useQuery(myRoomsQueryOptions());
}
