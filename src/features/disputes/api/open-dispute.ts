import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DisputeView, OpenDisputeInput } from '@shared/schemas/disputes';
import { api } from '@/lib/api-client';
import { bookingQueryOptions } from '@/features/bookings/api/get-booking';
import { bookingMoneyQueryOptions } from '@/features/payments/api/get-booking-money';
import { bookingDisputesQueryOptions } from './get-booking-disputes';

export async function openDispute(bookingId: string, input: OpenDisputeInput): Promise<DisputeView> {
  return (await api.post<{ dispute: DisputeView }>(`/api/bookings/${encodeURIComponent(bookingId)}/disputes`, input)).dispute;
}

/** Opening a dispute freezes the booking: its status and money panel change too. */
export function useOpenDispute(bookingId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: OpenDisputeInput) => openDispute(bookingId, input),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: bookingDisputesQueryOptions(bookingId).queryKey }),
        queryClient.invalidateQueries({ queryKey: bookingQueryOptions(bookingId).queryKey }),
        queryClient.invalidateQueries({ queryKey: bookingMoneyQueryOptions(bookingId).queryKey }),
      ]),
  });
}
