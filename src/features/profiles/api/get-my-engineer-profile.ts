import { queryOptions, useQuery } from '@tanstack/react-query';
import type { EngineerProfile } from '@shared/schemas/profiles';
import { api } from '@/lib/api-client';
import { profileKeys } from './keys';

export function getMyEngineerProfile(signal?: AbortSignal): Promise<{ profile: EngineerProfile }> {
  return api.get('/api/profile/engineer', { signal });
}

export function myEngineerProfileQueryOptions() {
  return queryOptions({ queryKey: profileKeys.myEngineer(), queryFn: ({ signal }) => getMyEngineerProfile(signal) });
}

export function useMyEngineerProfile(enabled = true) {
  return useQuery({ ...myEngineerProfileQueryOptions(), enabled });
}
