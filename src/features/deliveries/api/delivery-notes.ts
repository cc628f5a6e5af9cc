import { useMutation, useQueryClient } from '@tanstack/react-query';
import { deliveryPaths, type DeliveryNoteInput, type DeliveryNoteView } from '@shared/schemas/deliveries';
import { api } from '@/lib/api-client';
import { deliveryQueryOptions } from './get-delivery';

export async function addDeliveryNote(id: string, input: DeliveryNoteInput): Promise<DeliveryNoteView> {
  return (await api.post<{ note: DeliveryNoteView }>(deliveryPaths.notes(id), input)).note;
}
export async function removeDeliveryNote(id: string, noteId: string): Promise<void> {
  await api.delete(deliveryPaths.note(id, noteId));
}

export function useAddDeliveryNote(id: string) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (input: DeliveryNoteInput) => addDeliveryNote(id, input), onSuccess: () => void qc.invalidateQueries({ queryKey: deliveryQueryOptions(id).queryKey }) });
}

export function useRemoveDeliveryNote(id: string) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (noteId: string) => removeDeliveryNote(id, noteId), onSuccess: () => void qc.invalidateQueries({ queryKey: deliveryQueryOptions(id).queryKey }) });
}
