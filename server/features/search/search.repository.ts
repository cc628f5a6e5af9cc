import type Database from 'better-sqlite3';
import { DRUM_STYLES, type DrummerSearchItem, type SearchSort } from '@shared/schemas/profiles';

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
const BY_RATING = '(r.rating_avg IS NULL), r.rating_avg DESC, r.rating_count DESC';
const BY_AVAILABILITY = `r.taking_work DESC, ${BY_RATING}, r.updated_at DESC`;

function orderBy(sort: SearchSort, hasMatch: boolean): string {
  switch (sort) {
    case 'rate':
      // Rates compare only within one currency; without a currency filter, currencies group together.
      return 'r.currency, r.base_rate_minor, r.turnaround_days';
    case 'turnaround':
      return `r.turnaround_days, ${BY_AVAILABILITY}`;
    case 'rating':
      return `${BY_RATING}, r.taking_work DESC`;
    case 'best':
      return hasMatch ? `${RANK}, r.taking_work DESC` : BY_AVAILABILITY;
  }
}

/** The style's bit in drummer_search_rows.style_mask: its index in DRUM_STYLES (drizzle/0003 holds the same table). */
export function styleBit(style: string): number {
  const i = (DRUM_STYLES as readonly string[]).indexOf(style);
  if (i < 0) throw new RangeError(`unknown style ${style}`);
  return 2 ** i;
}

function whereOf(f: DrummerSearchFilters): { from: string; where: string[]; params: unknown[] } {
  const params: unknown[] = [];
  const where: string[] = [];
  // Only listed drummers have rows here (the triggers decide), so there is no "published" test to make.
  let from = 'drummer_search_rows r';
  if (f.match) {
    from = 'drummer_fts JOIN drummer_search_rows r ON r.rowid = drummer_fts.rowid';
    where.push('drummer_fts MATCH ?');
    params.push(f.match);
  }
  if (f.currency !== undefined) {
    where.push('r.currency = ?');
    params.push(f.currency);
  }
  if (f.maxRateMinor !== undefined) {
    where.push('r.base_rate_minor <= ?');
    params.push(f.maxRateMinor);
  }
  if (f.maxTurnaroundDays !== undefined) {
    where.push('r.turnaround_days <= ?');
    params.push(f.maxTurnaroundDays);
  }
  if (f.takingWork !== undefined) {
    where.push('r.taking_work = ?');
    params.push(f.takingWork ? 1 : 0);
  }
  if (f.offsetRange) {
    where.push('r.utc_offset_minutes BETWEEN ? AND ?');
    params.push(f.offsetRange.min, f.offsetRange.max);
  }
  if (f.style !== undefined) {
    where.push('(r.style_mask & ?) <> 0');
    params.push(styleBit(f.style));
  }
  return { from, where, params };
}

function hasRowFilters(f: DrummerSearchFilters): boolean {
  return [f.currency, f.maxRateMinor, f.maxTurnaroundDays, f.takingWork, f.offsetRange, f.style].some((v) => v !== undefined);
}

export function buildSearchSql(f: DrummerSearchFilters): { pageSql: string; countSql: string; params: unknown[] } {
  const { from, where, params } = whereOf(f);
  if (f.match && f.sort === 'best' && !hasRowFilters(f)) {
    // Words only, best match: the full-text index answers alone (it holds only listed drummers), and the
    // rows table is read for the page, not once per match — the commonest query, and the largest sets.
    return {
      pageSql: `SELECT r.user_id AS id FROM (SELECT rowid AS k, ${RANK} AS score FROM drummer_fts WHERE drummer_fts MATCH ? ORDER BY score, rowid LIMIT ? OFFSET ?) m
        JOIN drummer_search_rows r ON r.rowid = m.k ORDER BY m.score, m.k`,
      countSql: 'SELECT count(*) AS n FROM drummer_fts WHERE drummer_fts MATCH ?',
      params,
    };
  }
  const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
  const pageSql = `SELECT r.user_id AS id FROM ${from} ${whereSql} ORDER BY ${orderBy(f.sort, !!f.match)}, r.user_id LIMIT ? OFFSET ?`;
  const countSql = `SELECT count(*) AS n FROM ${from} ${whereSql}`;
  return { pageSql, countSql, params };
}

// Display fields for one page of ids only, in one statement (the ids travel as a JSON array).
const DETAILS_SQL = `SELECT p.user_id AS id, u.display_name AS displayName, p.headline, p.styles,
    p.base_rate_minor AS baseRateMinor, p.currency, p.turnaround_days AS turnaroundDays, p.taking_work AS takingWork,
    p.town, p.country, p.time_zone AS timeZone, p.rating_avg AS ratingAvg, p.rating_count AS ratingCount,
    (SELECT t.id FROM reel_tracks t WHERE t.drummer_id = p.user_id ORDER BY t.position, t.created_at LIMIT 1) AS reelTrackId
  FROM drummer_profiles p JOIN users u ON u.id = p.user_id
  WHERE p.user_id IN (SELECT value FROM json_each(?))`;

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

  const details = sqlite.prepare(DETAILS_SQL);

  return {
    search(f: DrummerSearchFilters): { items: DrummerSearchItem[]; total: number } {
      const { page, count, params } = prepared(f);
      const total = (count.get(...params) as { n: number }).n;
      // Past the last page there is nothing to fetch; the total still tells the client where the end is.
      const ids = f.offset < total ? (page.all(...params, f.limit, f.offset) as { id: string }[]).map((r) => r.id) : [];
      if (ids.length === 0) return { items: [], total };
      const byId = new Map((details.all(JSON.stringify(ids)) as Row[]).map((row) => [row.id, row]));
      const items = ids.flatMap((id) => {
        const row = byId.get(id);
        return row ? [toItem(row)] : [];
      });
      return { items, total };
    },
  };
}
export type SearchRepository = ReturnType<typeof createSearchRepository>;
