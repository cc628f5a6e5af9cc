import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DrummerProfileInput, OwnDrummerProfile } from '@shared/schemas/profiles';
import { api } from '@/lib/api-client';
import { profileKeys } from './keys';
import { myDrummerProfileQueryOptions } from './get-my-drummer-profile';
import { searchKeys } from '@/features/search/api/keys';

export function saveDrummerProfile(input: DrummerProfileInput): Promise<OwnDrummerProfile> {
  return api.put('/api/profile/drummer', input);
}

export function useSaveDrummerProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveDrummerProfile,
    onSuccess: (saved) => {
      queryClient.setQueryData(myDrummerProfileQueryOptions().queryKey, saved);
      void queryClient.invalidateQueries({ queryKey: profileKeys.drummer(saved.profile.userId) });
      // Search results show the headline, rate and styles.
      void queryClient.invalidateQueries({ queryKey: searchKeys.all });
    },
  });
}
