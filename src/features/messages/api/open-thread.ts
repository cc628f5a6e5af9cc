import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ThreadDetail } from '@shared/schemas/messages';
import { api } from '@/lib/api-client';
import { threadsQueryOptions } from './get-threads';

export type OpenThreadTarget = { briefId: string; drummerId?: string } | { bookingId: string };

/** Get-or-create the conversation about a brief (with one drummer) or a booking. */
export function openThread(target: OpenThreadTarget): Promise<{ thread: ThreadDetail }> {
  if ('bookingId' in target) return api.post(`/api/bookings/${encodeURIComponent(target.bookingId)}/thread`);
  return api.post(`/api/briefs/${encodeURIComponent(target.briefId)}/thread`, target.drummerId ? { drummerId: target.drummerId } : {});
}

export function useOpenThread() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: openThread,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: threadsQueryOptions().queryKey }),
  });
}
