import { useMutation, useQueryClient } from '@tanstack/react-query';
import { deliveryPaths, type DeliveryInput, type DeliveryView } from '@shared/schemas/deliveries';
import { api } from '@/lib/api-client';
import { bookingQueryOptions } from '@/features/bookings/api/get-booking';
import { bookingDeliveriesQueryOptions } from './get-booking-deliveries';

export async function createDelivery(bookingId: string, input: DeliveryInput): Promise<DeliveryView> {
  return (await api.post<{ delivery: DeliveryView }>(deliveryPaths.list(bookingId), input)).delivery;
}

export function useCreateDelivery(bookingId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: DeliveryInput) => createDelivery(bookingId, input),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: bookingDeliveriesQueryOptions(bookingId).queryKey });
      // The first delivery moves a funded booking to recording.
      void qc.invalidateQueries({ queryKey: bookingQueryOptions(bookingId).queryKey });
    },
  });
}
