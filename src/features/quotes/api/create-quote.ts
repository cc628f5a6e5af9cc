import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { QuoteValues, QuoteView } from '@shared/schemas/quotes';
import { api } from '@/lib/api-client';
import { briefKeys } from '@/features/briefs/api/keys';
import { quoteKeys } from './keys';

export async function createQuote({ briefId, input }: { briefId: string; input: QuoteValues }): Promise<QuoteView> {
  return (await api.post<{ quote: QuoteView }>(`/api/briefs/${encodeURIComponent(briefId)}/quotes`, input)).quote;
}

export function useCreateQuote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createQuote,
    onSuccess: (quote) => {
      queryClient.setQueryData(quoteKeys.detail(quote.id), quote);
      void queryClient.invalidateQueries({ queryKey: quoteKeys.mine() });
      // The brief now knows the reader's quote, and the open list marks it.
      void queryClient.invalidateQueries({ queryKey: briefKeys.all });
    },
  });
}
