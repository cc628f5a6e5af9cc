import type Database from 'better-sqlite3';
import type { DrummerSearchItem, SearchSort } from '@shared/schemas/profiles';

// Raw SQL on purpose: FTS5 MATCH and bm25() have no Drizzle builder, and the statements are prepared once
// per filter shape and reused, which keeps a search at a few milliseconds over 10,000 profiles.
// Tables and triggers: drizzle/0003_drummer-search.sql.

export type DrummerSearchFilters = {
  /** A safe FTS5 expression (see fts-query.ts), or null for "no words". */
  match: string | null;
  style?: string;
  currency?: string;
  maxRateMinor?: number;
  maxTurnaroundDays?: number;
  takingWork?: boolean;
  /** Inclusive standard-time UTC offset range in minutes. */
  offsetRange?: { min: number; max: number };
  sort: SearchSort;
  limit: number;
  offset: number;
};

type Row = {
  id: string;
  displayName: string;
  headline: string;
  styles: string;
  baseRateMinor: number;
  currency: string;
  turnaroundDays: number;
  takingWork: number;
  town: string;
  country: string;
  timeZone: string;
  ratingAvg: number | null;
  ratingCount: number;
  reelTrackId: string | null;
};

// Weights per FTS column (name, headline, bio, styles, tags, kit): a name or headline hit says more than a bio hit.
const RANK = 'bm25(drummer_fts, 8.0, 4.0, 1.0, 3.0, 2.0, 1.0)';
const BY_RATING = '(p.rating_avg IS NULL), p.rating_avg DESC, p.rating_count DESC';
const BY_AVAILABILITY = `p.taking_work DESC, ${BY_RATING}, p.updated_at DESC`;

function orderBy(sort: SearchSort, hasMatch: boolean): string {
  switch (sort) {
    case 'rate':
      // Rates compare only within one currency; without a currency filter, currencies group together.
      return 'p.currency, p.base_rate_minor, p.turnaround_days';
    case 'turnaround':
      return `p.turnaround_days, ${BY_AVAILABILITY}`;
    case 'rating':
      return `${BY_RATING}, p.taking_work DESC`;
    case 'best':
      return hasMatch ? `${RANK}, p.taking_work DESC` : BY_AVAILABILITY;
  }
}

function whereOf(f: DrummerSearchFilters): { from: string; where: string[]; params: unknown[] } {
  const params: unknown[] = [];
  const where: string[] = [];
  let from = 'drummer_profiles p';
  if (f.match) {
    from = 'drummer_fts JOIN drummer_search_keys k ON k.rowid = drummer_fts.rowid JOIN drummer_profiles p ON p.user_id = k.user_id';
    where.push('drummer_fts MATCH ?');
    params.push(f.match);
  }
  from += ' JOIN users u ON u.id = p.user_id';
  where.push("p.published = 1", "p.headline <> ''", 'u.disabled_at IS NULL');
  if (f.currency !== undefined) {
    where.push('p.currency = ?');
    params.push(f.currency);
  }
  if (f.maxRateMinor !== undefined) {
    where.push('p.base_rate_minor <= ?');
    params.push(f.maxRateMinor);
  }
  if (f.maxTurnaroundDays !== undefined) {
    where.push('p.turnaround_days <= ?');
    params.push(f.maxTurnaroundDays);
  }
  if (f.takingWork !== undefined) {
    where.push('p.taking_work = ?');
    params.push(f.takingWork ? 1 : 0);
  }
  if (f.offsetRange) {
    where.push('p.utc_offset_minutes BETWEEN ? AND ?');
    params.push(f.offsetRange.min, f.offsetRange.max);
  }
  if (f.style !== undefined) {
    // EXISTS, not IN (…): with IN the planner probes the whole style list once per FTS match.
    where.push('EXISTS (SELECT 1 FROM drummer_styles s WHERE s.style = ? AND s.user_id = p.user_id)');
    params.push(f.style);
  }
  return { from, where, params };
}

export function buildSearchSql(f: DrummerSearchFilters): { pageSql: string; countSql: string; params: unknown[] } {
  const { from, where, params } = whereOf(f);
  const whereSql = where.join(' AND ');
  const pageSql = `SELECT p.user_id AS id, u.display_name AS displayName, p.headline, p.styles,
      p.base_rate_minor AS baseRateMinor, p.currency, p.turnaround_days AS turnaroundDays, p.taking_work AS takingWork,
      p.town, p.country, p.time_zone AS timeZone, p.rating_avg AS ratingAvg, p.rating_count AS ratingCount,
      (SELECT r.id FROM reel_tracks r WHERE r.drummer_id = p.user_id ORDER BY r.position, r.created_at LIMIT 1) AS reelTrackId
    FROM ${from} WHERE ${whereSql} ORDER BY ${orderBy(f.sort, !!f.match)}, p.user_id LIMIT ? OFFSET ?`;
  const countSql = `SELECT count(*) AS n FROM ${from} WHERE ${whereSql}`;
  return { pageSql, countSql, params };
}

function toItem(row: Row): DrummerSearchItem {
  const item: DrummerSearchItem = {
    id: row.id,
    displayName: row.displayName,
    headline: row.headline,
    styles: JSON.parse(row.styles) as string[],
    baseRateMinor: row.baseRateMinor,
    currency: row.currency,
    turnaroundDays: row.turnaroundDays,
    takingWork: row.takingWork === 1,
    town: row.town,
    country: row.country,
    timeZone: row.timeZone,
    ratingAvg: row.ratingAvg,
    ratingCount: row.ratingCount,
  };
  if (row.reelTrackId) item.reelTrackId = row.reelTrackId;
  return item;
}

export function createSearchRepository(sqlite: Database.Database) {
  const statements = new Map<string, { page: Database.Statement; count: Database.Statement }>();

  function prepared(f: DrummerSearchFilters) {
    const built = buildSearchSql(f);
    // The SQL text depends only on which filters are set and the sort, so it is the cache key.
    const key = built.pageSql;
    let s = statements.get(key);
    if (!s) {
      s = { page: sqlite.prepare(built.pageSql), count: sqlite.prepare(built.countSql) };
      statements.set(key, s);
    }
    return { ...s, params: built.params };
  }

  return {
    search(f: DrummerSearchFilters): { items: DrummerSearchItem[]; total: number } {
      const { page, count, params } = prepared(f);
      const total = (count.get(...params) as { n: number }).n;
      // Past the last page there is nothing to fetch; the total still tells the client where the end is.
      const rows = f.offset < total ? (page.all(...params, f.limit, f.offset) as Row[]) : [];
      return { items: rows.map(toItem), total };
    },
  };
}
export type SearchRepository = ReturnType<typeof createSearchRepository>;
