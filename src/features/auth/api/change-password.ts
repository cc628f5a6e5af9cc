import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordInput } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';

export async function changePassword(input: ChangePasswordInput): Promise<void> {
  await api.post('/api/account/password', input);
}

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
