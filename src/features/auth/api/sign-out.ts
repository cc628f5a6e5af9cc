import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { setMe } from './set-me';
import { authKeys } from './keys';

export function signOut(): Promise<void> {
  return api.post('/api/auth/logout');
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      // Nothing cached for the previous person may show to the next one on this device.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== authKeys.me[0] });
      setMe(queryClient, null);
    },
  });
}
