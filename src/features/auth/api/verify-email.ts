import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MeUser } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { setMe } from './set-me';

export function verifyEmail(token: string): Promise<{ user: MeUser }> {
  return api.post('/api/auth/verify-email', { token });
}

export function useVerifyEmail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: verifyEmail,
    onSuccess: ({ user }) => setMe(queryClient, user),
  });
}
