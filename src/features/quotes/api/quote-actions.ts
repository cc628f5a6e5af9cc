import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingView } from '@shared/schemas/bookings';
import type { QuoteView } from '@shared/schemas/quotes';
import { api } from '@/lib/api-client';
import { briefKeys } from '@/features/briefs/api/keys';
import { bookingKeys } from '@/features/bookings/api/keys';
import { quoteKeys } from './keys';

const quotePath = (id: string) => `/api/quotes/${encodeURIComponent(id)}`;

export async function withdrawQuote(id: string): Promise<QuoteView> {
  return (await api.post<{ quote: QuoteView }>(`${quotePath(id)}/withdraw`)).quote;
}

export async function declineQuote({ id, reason }: { id: string; reason?: string }): Promise<QuoteView> {
  return (await api.post<{ quote: QuoteView }>(`${quotePath(id)}/decline`, reason ? { reason } : {})).quote;
}

export async function acceptQuote(id: string): Promise<BookingView> {
  return (await api.post<{ booking: BookingView }>(`${quotePath(id)}/accept`)).booking;
}

export async function respondAsEngineer({ id, confirm }: { id: string; confirm: boolean }): Promise<QuoteView> {
  return (await api.post<{ quote: QuoteView }>(`${quotePath(id)}/engineer-response`, { confirm })).quote;
}

/** Every quote action can change lists on both sides, so the whole quotes feature is refreshed. */
function useQuoteMutation<TInput, TResult>(fn: (input: TInput) => Promise<TResult>, alsoInvalidate: ReadonlyArray<readonly unknown[]> = []) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: quoteKeys.all });
      for (const queryKey of alsoInvalidate) void queryClient.invalidateQueries({ queryKey });
    },
  });
}

export const useWithdrawQuote = () => useQuoteMutation(withdrawQuote, [briefKeys.all]);
export const useDeclineQuote = () => useQuoteMutation(declineQuote);
export const useAcceptQuote = () => useQuoteMutation(acceptQuote, [briefKeys.all, bookingKeys.all]);
export const useRespondAsEngineer = () => useQuoteMutation(respondAsEngineer);
