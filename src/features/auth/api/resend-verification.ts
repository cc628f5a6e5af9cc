import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export async function resendVerification(): Promise<void> {
  await api.post('/api/auth/resend-verification');
}

export function useResendVerification() {
  return useMutation({ mutationFn: resendVerification });
}
