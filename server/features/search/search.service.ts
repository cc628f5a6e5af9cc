import type { DrummerSearchQuery, DrummerSearchResult } from '@shared/schemas/profiles';
import { TZ_BANDS, maxRateToMinor } from '@shared/schemas/profiles';
import type { DrummerSearchFilters, SearchRepository } from './search.repository';
import { toFtsMatch } from './fts-query';

/** The validated query string → the repository's filters (minor units, offset ranges, a safe MATCH). */
export function toSearchFilters(q: DrummerSearchQuery): DrummerSearchFilters {
  const band = q.tzBand ? TZ_BANDS[q.tzBand] : undefined;
  return {
    match: toFtsMatch(q.q),
    style: q.style,
    currency: q.currency,
    maxRateMinor: q.maxRate !== undefined && q.currency ? maxRateToMinor(q.maxRate, q.currency) : undefined,
    maxTurnaroundDays: q.maxTurnaround,
    takingWork: q.takingWork,
    offsetRange: band ? { min: band.minMinutes, max: band.maxMinutes } : undefined,
    sort: q.sort,
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  };
}

export function createSearchService(repo: SearchRepository) {
  return {
    searchDrummers(query: DrummerSearchQuery): DrummerSearchResult {
      return repo.search(toSearchFilters(query));
    },
  };
}
export type SearchService = ReturnType<typeof createSearchService>;
