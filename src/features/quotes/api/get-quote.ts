import { queryOptions, useQuery } from '@tanstack/react-query';
import type { QuoteView } from '@shared/schemas/quotes';
import { api } from '@/lib/api-client';
import { quoteKeys } from './keys';

export async function getQuote(id: string, signal?: AbortSignal): Promise<QuoteView> {
  return (await api.get<{ quote: QuoteView }>(`/api/quotes/${encodeURIComponent(id)}`, { signal })).quote;
}

export function quoteQueryOptions(id: string) {
  return queryOptions({ queryKey: quoteKeys.detail(id), queryFn: ({ signal }) => getQuote(id, signal) });
}

export function useQuote(id: string) {
  return useQuery(quoteQueryOptions(id));
}
