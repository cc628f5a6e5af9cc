import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { BriefList, OpenBriefsQuery } from '@shared/schemas/briefs';
import { api } from '@/lib/api-client';
import { briefKeys } from './keys';

export function openBriefsSearch(filters: OpenBriefsQuery): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) {
    if (value !== undefined && value !== '' && !(key === 'page' && value === 1)) params.set(key, String(value));
  }
  return params.toString();
}

export function getOpenBriefs(filters: OpenBriefsQuery, signal?: AbortSignal): Promise<BriefList> {
  const qs = openBriefsSearch(filters);
  return api.get(`/api/briefs/open${qs ? `?${qs}` : ''}`, { signal });
}

export function openBriefsQueryOptions(filters: OpenBriefsQuery) {
  return queryOptions({
    queryKey: briefKeys.open(filters),
    queryFn: ({ signal }) => getOpenBriefs(filters, signal),
    // Keeps the last page on screen while the next filter's answer loads.
    placeholderData: keepPreviousData,
  });
}

export function useOpenBriefs(filters: OpenBriefsQuery) {
  return useQuery(openBriefsQueryOptions(filters));
}
