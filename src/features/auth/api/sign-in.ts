import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoginInput, MeUser } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { setMe } from './set-me';

export function signIn(input: LoginInput): Promise<{ user: MeUser }> {
  return api.post('/api/auth/login', input);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user }) => setMe(queryClient, user),
  });
}
