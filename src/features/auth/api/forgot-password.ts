import { useMutation } from '@tanstack/react-query';
import type { ForgotPasswordInput } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';

export async function forgotPassword(input: ForgotPasswordInput): Promise<void> {
  await api.post('/api/auth/forgot-password', input);
}

export function useForgotPassword() {
  return useMutation({ mutationFn: forgotPassword });
}
