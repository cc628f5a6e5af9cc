import { queryOptions, useQuery } from '@tanstack/react-query';
import type { QuoteComparison, QuoteList } from '@shared/schemas/quotes';
import { api } from '@/lib/api-client';
import { quoteKeys } from './keys';

export function getBriefQuotes(briefId: string, signal?: AbortSignal): Promise<QuoteList<QuoteComparison>> {
  return api.get(`/api/briefs/${encodeURIComponent(briefId)}/quotes`, { signal });
}

export function briefQuotesQueryOptions(briefId: string) {
  return queryOptions({ queryKey: quoteKeys.forBrief(briefId), queryFn: ({ signal }) => getBriefQuotes(briefId, signal) });
}

export function useBriefQuotes(briefId: string) {
  return useQuery(briefQuotesQueryOptions(briefId));
}
