import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { RoomSearchResult } from '@shared/schemas/rooms';
import { api } from '@/lib/api-client';
import { roomKeys } from './keys';

/** Filters as the query string carries them (empty values are left out). */
export type RoomFilters = Record<string, string>;

export async function searchRooms(filters: RoomFilters, signal?: AbortSignal): Promise<RoomSearchResult> {
  const qs = new URLSearchParams(Object.entries(filters).filter(([, v]) => v !== '')).toString();
  return api.get<RoomSearchResult>(`/api/rooms${qs ? `?${qs}` : ''}`, { signal });
}

export function roomSearchQueryOptions(filters: RoomFilters) {
  return queryOptions({ queryKey: roomKeys.search(filters), queryFn: ({ signal }) => searchRooms(filters, signal), placeholderData: keepPreviousData });
}

export function useRoomSearch(filters: RoomFilters) {
  return useQuery(roomSearchQueryOptions(filters));
}
