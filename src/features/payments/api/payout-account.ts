import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PayoutAccountView } from '@shared/schemas/payments';
import { api } from '@/lib/api-client';
import { paymentKeys } from './keys';

export async function getPayoutAccount(signal?: AbortSignal): Promise<PayoutAccountView> {
  return (await api.get<{ account: PayoutAccountView }>('/api/payouts/account', { signal })).account;
}

export function payoutAccountQueryOptions() {
  return queryOptions({ queryKey: paymentKeys.payoutAccount(), queryFn: ({ signal }) => getPayoutAccount(signal) });
}

export function usePayoutAccount(enabled: boolean) {
  return useQuery({ ...payoutAccountQueryOptions(), enabled });
}

/** Opens the processor's hosted onboarding page (a fresh link each time: links expire after minutes). */
export function useStartOnboarding() {
  return useMutation({
    mutationFn: () => api.post<{ url: string }>('/api/payouts/account/onboarding'),
    onSuccess: ({ url }) => window.location.assign(url),
  });
}

/** Back from onboarding: ask the processor for the account's state now rather than wait for its webhook. */
export function useRefreshPayoutAccount() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async () => (await api.post<{ account: PayoutAccountView }>('/api/payouts/account/refresh')).account,
    onSuccess: (account) => queryClient.setQueryData(payoutAccountQueryOptions().queryKey, account),
  });
}
