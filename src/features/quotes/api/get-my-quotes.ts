import { queryOptions, useQuery } from '@tanstack/react-query';
import type { QuoteList } from '@shared/schemas/quotes';
import { api } from '@/lib/api-client';
import { quoteKeys } from './keys';

export function getMyQuotes(signal?: AbortSignal): Promise<QuoteList> {
  return api.get('/api/quotes/mine', { signal });
}

export function myQuotesQueryOptions() {
  return queryOptions({ queryKey: quoteKeys.mine(), queryFn: ({ signal }) => getMyQuotes(signal) });
}

export function useMyQuotes(enabled = true) {
  return useQuery({ ...myQuotesQueryOptions(), enabled });
}
