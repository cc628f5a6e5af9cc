import Database from 'better-sqlite3';
import { benchQueries } from './bench/search';
import { drummerSearchQuerySchema } from './shared/schemas/profiles';
import { toSearchFilters } from './server/features/search/search.service';
import { createSearchRepository, buildSearchSql } from './server/features/search/search.repository';
const db = new Database('/tmp/kitlane-large-1/kitlane.db');
const repo = createSearchRepository(db);
const times: [number, string][] = [];
for (const q of benchQueries(120)) {
  const f = toSearchFilters(drummerSearchQuerySchema.parse(Object.fromEntries(q)));
  const t0 = performance.now(); repo.search(f); const dt = performance.now() - t0;
  times.push([dt, q.toString()]);
}
times.sort((a, b) => b[0] - a[0]);
console.log(times.slice(0, 12).map(([t, q]) => `${t.toFixed(1)}ms ${q}`).join('\n'));
console.log('median', times[60][0].toFixed(2));
const slow = drummerSearchQuerySchema.parse(Object.fromEntries(new URLSearchParams(times[0][1])));
const b = buildSearchSql(toSearchFilters(slow));
console.log(db.prepare('EXPLAIN QUERY PLAN ' + b.pageSql).all(...b.params, 20, 0));
