import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SessionPrepView } from '@shared/schemas/session-prep';
import { api } from '@/lib/api-client';
import { sessionPrepKeys } from './keys';

export async function getSessionPrep(bookingId: string, signal?: AbortSignal): Promise<SessionPrepView | null> {
  return (await api.get<{ prep: SessionPrepView | null }>(`/api/bookings/${encodeURIComponent(bookingId)}/prep`, { signal })).prep;
}

export function sessionPrepQueryOptions(bookingId: string) {
  // A booking without a room answers {prep: null}: it has no checklist.
  return queryOptions({ queryKey: sessionPrepKeys.forBooking(bookingId), queryFn: ({ signal }) => getSessionPrep(bookingId, signal) });
}

export function useSessionPrep(bookingId: string) {
  return useQuery(sessionPrepQueryOptions(bookingId));
}
