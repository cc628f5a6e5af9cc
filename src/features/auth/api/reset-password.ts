import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ResetPasswordInput } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { setMe } from './set-me';

export async function resetPassword(input: ResetPasswordInput): Promise<void> {
  await api.post('/api/auth/reset-password', input);
}

export function useResetPassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resetPassword,
    // The server ends every session of the account on reset, this browser's included.
    onSuccess: () => setMe(queryClient, null),
  });
}
