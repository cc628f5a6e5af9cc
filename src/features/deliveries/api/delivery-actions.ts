import { useMutation, useQueryClient } from '@tanstack/react-query';
import { deliveryPaths, type DeliveryView, type RequestChangesInput, type RequestChangesResult } from '@shared/schemas/deliveries';
import { api } from '@/lib/api-client';
import { bookingQueryOptions } from '@/features/bookings/api/get-booking';
import { bookingDeliveriesQueryOptions } from './get-booking-deliveries';
import { deliveryQueryOptions } from './get-delivery';
import { deliveryKeys } from './keys';

// The state changes of a delivery: submit (uploader), request changes and accept (songwriter). Each moves
// the booking too, so the booking and its delivery list are refreshed.

export async function submitDelivery(id: string): Promise<DeliveryView> {
  return (await api.post<{ delivery: DeliveryView }>(deliveryPaths.submit(id))).delivery;
}
export async function requestChanges(id: string, input: RequestChangesInput): Promise<RequestChangesResult> {
  return api.post<RequestChangesResult>(deliveryPaths.requestChanges(id), input);
}
export async function acceptDelivery(id: string): Promise<DeliveryView> {
  return (await api.post<{ delivery: DeliveryView }>(deliveryPaths.accept(id))).delivery;
}

function useRefresh(delivery: { id: string; bookingId: string }) {
  const qc = useQueryClient();
  return (updated?: DeliveryView) => {
    if (updated) qc.setQueryData(deliveryQueryOptions(delivery.id).queryKey, updated);
    void qc.invalidateQueries({ queryKey: deliveryKeys.all });
    void qc.invalidateQueries({ queryKey: bookingDeliveriesQueryOptions(delivery.bookingId).queryKey });
    void qc.invalidateQueries({ queryKey: bookingQueryOptions(delivery.bookingId).queryKey });
  };
}

export function useSubmitDelivery(delivery: { id: string; bookingId: string }) {
  const refresh = useRefresh(delivery);
  return useMutation({ mutationFn: () => submitDelivery(delivery.id), onSuccess: (d) => refresh(d) });
}

export function useRequestChanges(delivery: { id: string; bookingId: string }) {
  const refresh = useRefresh(delivery);
  return useMutation({ mutationFn: (input: RequestChangesInput) => requestChanges(delivery.id, input), onSuccess: (r) => refresh(r.delivery) });
}

export function useAcceptDelivery(delivery: { id: string; bookingId: string }) {
  const refresh = useRefresh(delivery);
  return useMutation({ mutationFn: () => acceptDelivery(delivery.id), onSuccess: (d) => refresh(d) });
}
