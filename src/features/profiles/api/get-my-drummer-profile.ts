import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OwnDrummerProfile } from '@shared/schemas/profiles';
import { api } from '@/lib/api-client';
import { profileKeys } from './keys';

export function getMyDrummerProfile(signal?: AbortSignal): Promise<OwnDrummerProfile> {
  return api.get('/api/profile/drummer', { signal });
}

export function myDrummerProfileQueryOptions() {
  return queryOptions({ queryKey: profileKeys.myDrummer(), queryFn: ({ signal }) => getMyDrummerProfile(signal) });
}

export function useMyDrummerProfile(enabled = true) {
  return useQuery({ ...myDrummerProfileQueryOptions(), enabled });
}
