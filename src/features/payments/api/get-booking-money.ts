import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BookingMoneyView } from '@shared/schemas/payments';
import { api } from '@/lib/api-client';
import { paymentKeys } from './keys';

export async function getBookingMoney(bookingId: string, signal?: AbortSignal): Promise<BookingMoneyView> {
  return (await api.get<{ money: BookingMoneyView }>(`/api/bookings/${encodeURIComponent(bookingId)}/money`, { signal })).money;
}

/** `waitingForFunds`: right after the processor's page sent the songwriter back, poll until the webhook landed. */
export function bookingMoneyQueryOptions(bookingId: string, waitingForFunds = false) {
  return queryOptions({
    queryKey: paymentKeys.money(bookingId),
    queryFn: ({ signal }) => getBookingMoney(bookingId, signal),
    refetchInterval: (query) => {
      const money = query.state.data;
      if (money?.stage !== 'awaiting_payment') return false;
      if (waitingForFunds) return 1000;
      // A checkout is open in another tab or was just declined: its outcome arrives by webhook.
      return money.payments.some((p) => p.status === 'open') ? 3000 : false;
    },
  });
}

export function useBookingMoney(bookingId: string, waitingForFunds = false) {
  return useQuery(bookingMoneyQueryOptions(bookingId, waitingForFunds));
}
