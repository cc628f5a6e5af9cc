import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { SEARCH_PAGE_SIZE, type DrummerSearchQuery, type DrummerSearchResult } from '@shared/schemas/profiles';
import { api } from '@/lib/api-client';
import { searchKeys } from './keys';

/** The query as URL parameters, leaving out defaults so shared links stay short. */
export function drummerSearchParams(query: Partial<DrummerSearchQuery>): URLSearchParams {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === '') continue;
    if (key === 'sort' && value === 'best') continue;
    if (key === 'page' && value === 1) continue;
    if (key === 'pageSize' && value === SEARCH_PAGE_SIZE) continue;
    params.set(key, String(value));
  }
  return params;
}

export function searchDrummers(query: DrummerSearchQuery, signal?: AbortSignal): Promise<DrummerSearchResult> {
  return api.get(`/api/drummers?${drummerSearchParams(query)}`, { signal });
}

export function drummerSearchQueryOptions(query: DrummerSearchQuery) {
  return queryOptions({ queryKey: searchKeys.list(query), queryFn: ({ signal }) => searchDrummers(query, signal), staleTime: 30_000 });
}

/** Keeps the last page on screen while the next one loads, so paging does not flash an empty list. */
export function useDrummerSearch(query: DrummerSearchQuery) {
  return useQuery({ ...drummerSearchQueryOptions(query), placeholderData: keepPreviousData });
}
