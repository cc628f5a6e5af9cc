// npm run bench:search: p50/p95 of GET /api/drummers over 10,000 invented profiles (scripts/seed-large.ts),
// through the real app over loopback HTTP, next to the same SQL run directly on SQLite (the repository the
// route calls, without HTTP, validation or JSON). Target: p95 under 20 ms (issue 3).
import { Agent, request } from 'node:http';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { parseEnv } from '../server/env';
import { boot } from '../server/boot';
import { LARGE_DEFAULT_DIR, seedLarge } from '../scripts/seed-large';
import { drummerSearchQuerySchema, DRUM_STYLES, RATE_CURRENCIES, SEARCH_SORTS, TZ_BAND_IDS } from '../shared/schemas/profiles';
import { createSearchRepository } from '../server/features/search/search.repository';
import { toSearchFilters } from '../server/features/search/search.service';

export type SearchBenchResult = {
  profiles: number;
  queries: number;
  p50Ms: number;
  p95Ms: number;
  p99Ms: number;
  maxMs: number;
  rawP50Ms: number;
  rawP95Ms: number;
  rawP99Ms: number;
  targetP95Ms: number;
  meanTotal: number;
};

export const SEARCH_TARGET_P95_MS = 20;

// Words as people would type them: very common ones (in nearly every profile), style names, rare ones,
// name fragments, and some with FTS syntax in them that must be read as plain words.
const WORDS = ['drummer', 'rock', 'funk', 'jazz brushes', 'ghost notes', 'double kick', 'room', 'warm', 'tight pocket', 'steel snare', 'ka', 'mer', 'vi', 'lo', 'quadel', 'singer', 'hip hop', 'r&b', 'percussion', 'home', 'grid', '"room sound"', 'kick*', 'NEAR(jazz', 'soft -loud', 'metal AND', 'demo:album'];

function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function benchQueries(n: number, seed = 42): URLSearchParams[] {
  const rand = prng(seed);
  const pick = <T>(list: readonly T[]) => list[Math.floor(rand() * list.length)];
  const out: URLSearchParams[] = [];
  for (let i = 0; i < n; i++) {
    const p = new URLSearchParams();
    const kind = rand();
    const withWords = kind < 0.65;
    const withFilters = kind >= 0.35;
    if (withWords) p.set('q', pick(WORDS));
    if (withFilters) {
      if (rand() < 0.5) p.set('style', pick(DRUM_STYLES));
      if (rand() < 0.4) {
        p.set('currency', pick(RATE_CURRENCIES));
        p.set('maxRate', String(100 + Math.floor(rand() * 400)));
      }
      if (rand() < 0.3) p.set('maxTurnaround', String(3 + Math.floor(rand() * 10)));
      if (rand() < 0.4) p.set('takingWork', 'true');
      if (rand() < 0.4) p.set('tzBand', pick(TZ_BAND_IDS));
    }
    p.set('sort', pick(SEARCH_SORTS));
    if (rand() < 0.15) p.set('page', String(2 + Math.floor(rand() * 10)));
    out.push(p);
  }
  return out;
}

function percentile(sorted: number[], q: number): number {
  if (sorted.length === 0) return NaN;
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[i];
}

const round2 = (v: number) => Math.round(v * 100) / 100;

// A plain keep-alive HTTP client: fetch (undici) spends about a millisecond of its own per request on this
// machine, and it runs in the same process as the server, so it would be measured as server time.
function getJson(agent: Agent, url: string): Promise<{ status: number; body: { total: number } }> {
  return new Promise((resolveGet, reject) => {
    const req = request(url, { agent }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => {
        try {
          resolveGet({ status: res.statusCode ?? 0, body: JSON.parse(Buffer.concat(chunks).toString('utf8')) as { total: number } });
        } catch (error) {
          reject(error);
        }
      });
    });
    req.on('error', reject);
    req.end();
  });
}

export async function runSearchBench(opts: { dataDir?: string; profiles?: number; queries?: number } = {}): Promise<SearchBenchResult> {
  const profiles = opts.profiles ?? 10_000;
  const dataDir = resolve(opts.dataDir ?? process.env.BENCH_DATA_DIR ?? LARGE_DEFAULT_DIR);
  await seedLarge(dataDir, profiles);
  const env = parseEnv({ ...process.env, NODE_ENV: 'production', DATA_DIR: dataDir, SEED_DEMO: 'false', START_FAKES: 'false', LOG_LEVEL: 'silent' });
  const running = await boot({ env, randomPorts: true, quiet: true, appDeps: { clientDist: null } });
  const agent = new Agent({ keepAlive: true, maxSockets: 1 });
  try {
    const queries = benchQueries(opts.queries ?? 500);
    const warmup = benchQueries(50, 7);
    for (const q of warmup) await getJson(agent, `${running.url}/api/drummers?${q}`);

    const http: number[] = [];
    let totals = 0;
    for (const q of queries) {
      const t0 = performance.now();
      const res = await getJson(agent, `${running.url}/api/drummers?${q}`);
      http.push(performance.now() - t0);
      if (res.status !== 200) throw new Error(`search answered ${res.status} for ${q}`);
      totals += res.body.total;
    }

    const repo = createSearchRepository(running.db.$client);
    const filters = queries.map((q) => toSearchFilters(drummerSearchQuerySchema.parse(Object.fromEntries(q))));
    for (const f of filters.slice(0, 50)) repo.search(f);
    const raw: number[] = [];
    for (const f of filters) {
      const t0 = performance.now();
      repo.search(f);
      raw.push(performance.now() - t0);
    }
    http.sort((a, b) => a - b);
    raw.sort((a, b) => a - b);
    return {
      profiles,
      queries: queries.length,
      p50Ms: round2(percentile(http, 0.5)),
      p95Ms: round2(percentile(http, 0.95)),
      p99Ms: round2(percentile(http, 0.99)),
      maxMs: round2(http[http.length - 1]),
      rawP50Ms: round2(percentile(raw, 0.5)),
      rawP95Ms: round2(percentile(raw, 0.95)),
      rawP99Ms: round2(percentile(raw, 0.99)),
      targetP95Ms: SEARCH_TARGET_P95_MS,
      meanTotal: Math.round(totals / queries.length),
    };
  } finally {
    agent.destroy();
    await running.close();
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  const r = await runSearchBench();
  console.log(`drummer search over ${r.profiles} profiles, ${r.queries} mixed queries (mean ${r.meanTotal} matches each)`);
  console.table({
    'API (HTTP, in-process)': { p50_ms: r.p50Ms, p95_ms: r.p95Ms, p99_ms: r.p99Ms },
    'same SQL on SQLite': { p50_ms: r.rawP50Ms, p95_ms: r.rawP95Ms, p99_ms: r.rawP99Ms },
  });
  console.log(`target p95 < ${r.targetP95Ms} ms: ${r.p95Ms < r.targetP95Ms ? 'met' : 'NOT met'}`);
}
