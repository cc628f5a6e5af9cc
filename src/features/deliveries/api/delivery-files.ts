import { useMutation, useQueryClient } from '@tanstack/react-query';
import { deliveryPaths, type DeliveryFileInput, type DeliveryFileView } from '@shared/schemas/deliveries';
import { api } from '@/lib/api-client';
import { deliveryQueryOptions } from './get-delivery';

// The file rows of a delivery: announce a file before its bytes go up (tus), correct its part, remove it.

export async function addDeliveryFile(deliveryId: string, input: DeliveryFileInput): Promise<DeliveryFileView> {
  return (await api.post<{ file: DeliveryFileView }>(deliveryPaths.files(deliveryId), input)).file;
}

export async function updateDeliveryFile(deliveryId: string, fileId: string, part: string | null): Promise<DeliveryFileView> {
  return (await api.patch<{ file: DeliveryFileView }>(deliveryPaths.file(deliveryId, fileId), { part })).file;
}

export async function removeDeliveryFile(deliveryId: string, fileId: string): Promise<void> {
  await api.delete(deliveryPaths.file(deliveryId, fileId));
}

export function useUpdateDeliveryFile(deliveryId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ fileId, part }: { fileId: string; part: string | null }) => updateDeliveryFile(deliveryId, fileId, part),
    onSuccess: () => void qc.invalidateQueries({ queryKey: deliveryQueryOptions(deliveryId).queryKey }),
  });
}
