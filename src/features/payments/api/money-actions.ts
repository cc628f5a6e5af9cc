import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { bookingKeys } from '@/features/bookings/api/keys';
import { paymentKeys } from './keys';

// One file for the booking's money buttons: each posts one action, then the money panel and the booking reload.
export type MoneyAction = 'cancel' | 'release';

export function postMoneyAction(bookingId: string, action: MoneyAction): Promise<unknown> {
  return api.post(`/api/bookings/${encodeURIComponent(bookingId)}/${action}`, action === 'release' ? { reason: 'Delivery accepted' } : {});
}

export function syncCheckout(bookingId: string, sessionId: string): Promise<unknown> {
  return api.post(`/api/bookings/${encodeURIComponent(bookingId)}/checkout/sync`, { sessionId });
}

export function useMoneyAction(bookingId: string, action: MoneyAction) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => postMoneyAction(bookingId, action),
    onSettled: async () => {
      await queryClient.invalidateQueries({ queryKey: paymentKeys.money(bookingId) });
      await queryClient.invalidateQueries({ queryKey: bookingKeys.detail(bookingId) });
    },
  });
}
