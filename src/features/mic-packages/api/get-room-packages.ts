import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MicPackageList } from '@shared/schemas/mic-packages';
import { api } from '@/lib/api-client';
import { micPackageKeys } from './keys';

export async function getRoomPackages(roomId: string, signal?: AbortSignal): Promise<MicPackageList> {
  return api.get<MicPackageList>(`/api/rooms/${encodeURIComponent(roomId)}/packages`, { signal });
}

export function roomPackagesQueryOptions(roomId: string) {
  return queryOptions({ queryKey: micPackageKeys.forRoom(roomId), queryFn: ({ signal }) => getRoomPackages(roomId, signal) });
}

export function useRoomPackages(roomId: string) {
  return useQuery(roomPackagesQueryOptions(roomId));
}
