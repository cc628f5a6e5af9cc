import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PrepItemId, SessionPrepView } from '@shared/schemas/session-prep';
import { api } from '@/lib/api-client';
import { sessionPrepQueryOptions } from './get-session-prep';

export async function tickPrepItem({ bookingId, itemId, done }: { bookingId: string; itemId: PrepItemId; done: boolean }): Promise<SessionPrepView> {
  return (await api.put<{ prep: SessionPrepView }>(`/api/bookings/${encodeURIComponent(bookingId)}/prep/${itemId}`, { done })).prep;
}

export function useTickPrepItem(bookingId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (v: { itemId: PrepItemId; done: boolean }) => tickPrepItem({ bookingId, ...v }),
    onSuccess: (prep) => queryClient.setQueryData(sessionPrepQueryOptions(bookingId).queryKey, prep),
  });
}
