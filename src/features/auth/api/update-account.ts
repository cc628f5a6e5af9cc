import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MeUser, UpdateAccountInput } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { setMe } from './set-me';

export function updateAccount(input: UpdateAccountInput): Promise<{ user: MeUser }> {
  return api.patch('/api/account', input);
}

export function useUpdateAccount() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateAccount,
    onSuccess: ({ user }) => setMe(queryClient, user),
  });
}
