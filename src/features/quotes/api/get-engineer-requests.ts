import { queryOptions, useQuery } from '@tanstack/react-query';
import type { QuoteList } from '@shared/schemas/quotes';
import { api } from '@/lib/api-client';
import { quoteKeys } from './keys';

export function getEngineerRequests(signal?: AbortSignal): Promise<QuoteList> {
  return api.get('/api/quotes/engineer-requests', { signal });
}

export function engineerRequestsQueryOptions() {
  return queryOptions({ queryKey: quoteKeys.engineerRequests(), queryFn: ({ signal }) => getEngineerRequests(signal) });
}

export function useEngineerRequests(enabled = true) {
  return useQuery({ ...engineerRequestsQueryOptions(), enabled });
}
