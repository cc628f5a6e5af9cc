import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MeUser, SignupInput } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { setMe } from './set-me';

export function signUp(input: SignupInput): Promise<{ user: MeUser }> {
  return api.post('/api/auth/signup', input);
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: ({ user }) => setMe(queryClient, user),
  });
}
