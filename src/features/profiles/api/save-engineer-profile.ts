import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { EngineerProfile, EngineerProfileInput } from '@shared/schemas/profiles';
import { api } from '@/lib/api-client';
import { profileKeys } from './keys';
import { myEngineerProfileQueryOptions } from './get-my-engineer-profile';

export function saveEngineerProfile(input: EngineerProfileInput): Promise<{ profile: EngineerProfile }> {
  return api.put('/api/profile/engineer', input);
}

export function useSaveEngineerProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveEngineerProfile,
    onSuccess: (saved) => {
      queryClient.setQueryData(myEngineerProfileQueryOptions().queryKey, saved);
      void queryClient.invalidateQueries({ queryKey: profileKeys.engineer(saved.profile.userId) });
    },
  });
}
