// npm run bench (load row), or `tsx bench/load.ts [--quick]`: mixed traffic against the real server in its own
// process, over the large world — 10,000 drummers (scripts/seed-large.ts) plus, added here with bulk inserts,
// 2,000 rooms (through the rooms service, so acoustics are computed as in production), 50,000 briefs and
// 50,000 messages in 5,000 threads. autocannon, 100 connections for 30 s (5 s with --quick): search, profile
// pages, thread polling and sign-in. Target: zero errors. Sign-in limits are raised in the server process so
// the figure is throughput, not the limiter; any 429 is still counted, apart from errors.
import { spawn, type ChildProcess } from 'node:child_process';
import { get } from 'node:http';
import type { Socket } from 'node:net';
import { randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { and, eq, like, sql } from 'drizzle-orm';
import { openDb, type Db } from '../server/db/client';
import { applyMigrations } from '../server/db/migrate';
import { briefs, drummerProfiles, messages, rooms, threadParticipants, threads, users } from '../server/db/schema';
import { hashPassword } from '../server/auth/password';
import { createRoomsService } from '../server/features/rooms/rooms.service';
import { createLocalStorage } from '../server/storage/storage';
import { createLogger } from '../server/logger';
import { LARGE_EMAIL_DOMAIN, seedLarge } from '../scripts/seed-large';
import { roomBody } from '../tests/api/helpers/room-bodies';
import { DEFAULT_LIMITS, type Limits } from '../server/http/rate-limit';

const PASSWORD = 'kitlane-demo-pass';
export const LOAD_WORLD = { drummers: 10_000, engineers: 200, rooms: 2_000, songwriters: 1_000, briefs: 50_000, threads: 5_000, messagesPerThread: 10 };
const DEFAULT_DIR = join(tmpdir(), 'kitlane-bench-large');

// ---------------------------------------------------------------- world

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

const count = (db: Db, table: typeof briefs | typeof messages | typeof users | typeof rooms, where?: ReturnType<typeof like>) =>
  db.select({ n: sql<number>`count(*)` }).from(table).where(where).get()?.n ?? 0;

/** Inserts rows in chunks inside one transaction: SQLite's variable limit caps a single multi-row insert. */
function bulkInsert<T>(db: Db, rows: T[], insert: (chunk: T[]) => void, chunkSize = 200): void {
  db.$client.transaction(() => {
    for (let i = 0; i < rows.length; i += chunkSize) insert(rows.slice(i, i + chunkSize));
  })();
}

function addPeople(db: Db, role: 'songwriter' | 'engineer', n: number, passwordHash: string): void {
  const now = new Date();
  const rows = Array.from({ length: n }, (_, i) => ({
    id: randomUUID(),
    email: `${role}-${String(i + 1).padStart(5, '0')}@${LARGE_EMAIL_DOMAIN}`,
    displayName: `Load ${role} ${i + 1}`,
    passwordHash,
    roles: [role],
    emailVerifiedAt: now,
    timeZone: 'UTC',
    createdAt: now,
  }));
  bulkInsert(db, rows, (chunk) => db.insert(users).values(chunk).run());
}

const idsOf = (db: Db, prefix: string) => db.select({ id: users.id }).from(users).where(like(users.email, `${prefix}-%@${LARGE_EMAIL_DOMAIN}`)).all().map((r) => r.id);

function addRooms(db: Db, engineerIds: string[], n: number): void {
  const service = createRoomsService({ db, storage: createLocalStorage(join(tmpdir(), 'kitlane-bench-unused-files')), logger: createLogger('silent') });
  const rand = prng(7);
  db.$client.transaction(() => {
    for (let i = 0; i < n; i++) {
      const engineerId = engineerIds[i % engineerIds.length];
      const user = { id: engineerId, email: '', displayName: '', roles: ['engineer'], emailVerified: true, timeZone: 'UTC' };
      const length = 4 + Math.round(rand() * 80) / 10;
      service.create(user, roomBody({ name: `Room ${i + 1}`, dayRateMinor: 20_000 + Math.floor(rand() * 60_000), halfDayRateMinor: 12_000, dimensions: { unit: 'm', length, width: 3 + Math.round(rand() * 40) / 10, height: 2.4 + Math.round(rand() * 20) / 10 } }) as never);
    }
  })();
}

function addBriefs(db: Db, songwriterIds: string[], n: number): string[] {
  const rand = prng(11);
  const now = Date.now();
  const rows = Array.from({ length: n }, (_, i) => ({
    id: randomUUID(),
    songwriterId: songwriterIds[i % songwriterIds.length],
    status: (rand() < 0.7 ? 'open' : 'draft') as 'open' | 'draft',
    songTitle: `Load song ${i + 1}`,
    description: 'A mid-tempo song that wants a steady kit with room mics.',
    style: 'rock',
    tempoBpm: 80 + Math.floor(rand() * 80),
    lengthBars: 64 + Math.floor(rand() * 64),
    budgetMinMinor: 10_000,
    budgetMaxMinor: 40_000,
    currency: 'USD',
    deadline: '2027-06-30',
    publishedAt: new Date(now - i * 1000),
    createdAt: new Date(now - i * 1000),
    updatedAt: new Date(now - i * 1000),
  }));
  bulkInsert(db, rows, (chunk) => db.insert(briefs).values(chunk).run());
  return rows.map((r) => r.id);
}

function addThreads(db: Db, briefIds: string[], songwriterOf: Map<string, string>, drummerIds: string[]): void {
  const now = Date.now();
  const threadRows = Array.from({ length: LOAD_WORLD.threads }, (_, i) => ({
    id: randomUUID(),
    kind: 'brief' as const,
    briefId: briefIds[i],
    drummerId: drummerIds[i % drummerIds.length],
    subject: `Load song ${i + 1}`,
    lastMessageAt: new Date(now),
    createdAt: new Date(now - 86_400_000),
  }));
  bulkInsert(db, threadRows, (chunk) => db.insert(threads).values(chunk).run());
  const participants = threadRows.flatMap((t) => [
    { threadId: t.id, userId: songwriterOf.get(t.briefId)! },
    { threadId: t.id, userId: t.drummerId },
  ]);
  bulkInsert(db, participants, (chunk) => db.insert(threadParticipants).values(chunk).run());
  const messageRows = threadRows.flatMap((t) =>
    Array.from({ length: LOAD_WORLD.messagesPerThread }, (_, k) => ({
      id: randomUUID(),
      threadId: t.id,
      senderId: k % 2 === 0 ? songwriterOf.get(t.briefId)! : t.drummerId,
      body: `Message ${k + 1} about the fills in the second chorus.`,
      createdAt: new Date(now - (LOAD_WORLD.messagesPerThread - k) * 60_000),
    })),
  );
  bulkInsert(db, messageRows, (chunk) => db.insert(messages).values(chunk).run(), 500);
}

/** Makes (once) the large world in dataDir; later runs reuse it. */
export async function seedLoadWorld(dataDir: string): Promise<{ ms: number }> {
  const started = performance.now();
  mkdirSync(dataDir, { recursive: true });
  await seedLarge(dataDir, LOAD_WORLD.drummers, PASSWORD);
  const db = openDb(join(dataDir, 'kitlane.db'));
  try {
    applyMigrations(db);
    if (count(db, briefs) >= LOAD_WORLD.briefs) return { ms: performance.now() - started };
    const passwordHash = await hashPassword(PASSWORD);
    // One transaction for everything past the drummers (the steps' own become savepoints): a run stopped
    // half-way leaves nothing behind, so the next run starts this part again instead of meeting taken emails.
    db.$client.transaction(() => {
      addPeople(db, 'engineer', LOAD_WORLD.engineers, passwordHash);
      addPeople(db, 'songwriter', LOAD_WORLD.songwriters, passwordHash);
      addRooms(db, idsOf(db, 'engineer'), LOAD_WORLD.rooms);
      const songwriterIds = idsOf(db, 'songwriter');
      const briefIds = addBriefs(db, songwriterIds, LOAD_WORLD.briefs);
      const songwriterOf = new Map(db.select({ id: briefs.id, songwriterId: briefs.songwriterId }).from(briefs).all().map((b) => [b.id, b.songwriterId]));
      addThreads(db, briefIds, songwriterOf, idsOf(db, 'drummer'));
    })();
    db.$client.pragma('optimize');
    return { ms: performance.now() - started };
  } finally {
    db.$client.close();
  }
}

/** What dataDir holds of the load world: lets a run show that it measured the large world and not a partial one. */
export function countLoadWorld(dataDir: string): { drummers: number; rooms: number; briefs: number; messages: number } {
  const db = openDb(join(resolve(dataDir), 'kitlane.db'));
  try {
    return { drummers: count(db, users, like(users.email, `drummer-%@${LARGE_EMAIL_DOMAIN}`)), rooms: count(db, rooms), briefs: count(db, briefs), messages: count(db, messages) };
  } finally {
    db.$client.close();
  }
}

/** $BENCH_LARGE_DIR, else one fixed folder under the OS temp dir, made on the first run and reused after. */
export const loadWorldDir = () => resolve(process.env.BENCH_LARGE_DIR ?? DEFAULT_DIR);

// ---------------------------------------------------------------- server process

// A limit high enough never to trigger during the run (the run measures throughput); 429s are still counted.
const UNLIMITED: Partial<Limits> = Object.fromEntries(Object.entries(DEFAULT_LIMITS).map(([k, v]) => [k, { ...v, limit: 1_000_000 }]));

async function serve(dataDir: string): Promise<void> {
  const { parseEnv } = await import('../server/env');
  const { boot } = await import('../server/boot');
  const env = parseEnv({ ...process.env, NODE_ENV: 'production', DATA_DIR: dataDir, SEED_DEMO: 'false', START_FAKES: 'false', LOG_LEVEL: 'error', PORT: '0' });
  const running = await boot({ env, randomPorts: true, quiet: true, appDeps: { clientDist: null, limits: UNLIMITED } });
  process.stdout.write(`READY ${running.url}\n`);
  const stop = () => void running.close().then(() => process.exit(0));
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

function startServer(dataDir: string): Promise<{ url: string; child: ChildProcess }> {
  const child = spawn(process.execPath, ['--import', 'tsx', fileURLToPath(import.meta.url), '--serve', dataDir], { stdio: ['ignore', 'pipe', 'inherit'] });
  return new Promise((res, rej) => {
    let out = '';
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const m = /READY (\S+)/.exec(out);
      if (m) res({ url: m[1], child });
    });
    child.once('exit', (code) => rej(new Error(`load server exited ${code} before it was ready`)));
  });
}

// ---------------------------------------------------------------- traffic

// `shape` is ours: autocannon copies each request object, and the copy keeps it, so a client's current request names its route.
type AutocannonRequest = { method?: string; path: string; headers?: Record<string, string>; body?: string; shape?: string; onResponse?: (status: number, body: string) => void };
type AutocannonResult = {
  requests: { average: number; total: number };
  errors: number;
  timeouts: number;
  non2xx: number;
  statusCodeStats: Record<string, { count: number }>;
  duration: number;
};
// The returned tracker is both a promise of the summary and an event emitter of each response.
// One connection: with pipelining 1 its current request is the one in flight, so a response or a timeout
// can be put down to its route.
// `_doRequest` and `conn` are autocannon 9's own (pinned in package-lock): see openAllFirst.
type AutocannonClient = {
  requestIterator: { currentRequest: AutocannonRequest; nextRequest(): void };
  on(event: 'timeout', fn: () => void): void;
  _doRequest(): void;
  conn: Socket;
};
type AutocannonTracker = PromiseLike<AutocannonResult> & { on(event: 'response', fn: (client: AutocannonClient, status: number, bytes: number, ms: number) => void): void };
type Autocannon = (opts: { url: string; connections: number; duration: number; requests: AutocannonRequest[]; setupClient?: (client: AutocannonClient) => void }) => AutocannonTracker;
const autocannon = createRequire(import.meta.url)('autocannon') as Autocannon;

async function signIn(url: string, email: string): Promise<string> {
  const res = await fetch(`${url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: PASSWORD }) });
  if (res.status !== 200) throw new Error(`sign-in for ${email} answered ${res.status}`);
  return res.headers.getSetCookie().find((c) => c.startsWith('kitlane_session='))!.split(';')[0];
}

/**
 * Drummers whose public page exists: published with a headline (the rule of isDrummerListed). seed-large
 * leaves about 5 % as drafts, and a draft's page is a 404 — asking for one measured the plan, not the product.
 */
function listedDrummerIds(db: Db, n: number): string[] {
  return db
    .select({ id: drummerProfiles.userId })
    .from(drummerProfiles)
    .innerJoin(users, eq(users.id, drummerProfiles.userId))
    .where(and(eq(drummerProfiles.published, true), sql`trim(${drummerProfiles.headline}) <> ''`, like(users.email, `drummer-%@${LARGE_EMAIL_DOMAIN}`)))
    .orderBy(users.email)
    .limit(n)
    .all()
    .map((r) => r.id);
}

const SEARCH_WORDS = ['rock', 'funk', 'jazz brushes', 'ghost notes', 'room', 'tight pocket', 'ka', 'double kick', ''];

/** One connection's cycle: roughly 40 % search, 25 % profile pages, 30 % thread polling, 5 % sign-in. */
async function trafficPlan(url: string, dataDir: string): Promise<AutocannonRequest[]> {
  const db = openDb(join(dataDir, 'kitlane.db'));
  let polling: { threadId: string; email: string }[];
  let drummerIds: string[];
  try {
    polling = db
      .select({ threadId: threads.id, email: users.email })
      .from(threads)
      .innerJoin(briefs, eq(briefs.id, threads.briefId))
      .innerJoin(users, eq(users.id, briefs.songwriterId))
      .limit(10)
      .all();
    drummerIds = listedDrummerIds(db, 400);
  } finally {
    db.$client.close();
  }
  const cookies = await Promise.all(polling.map((p) => signIn(url, p.email)));
  const plan: AutocannonRequest[] = [];
  for (let i = 0; i < 20; i++) {
    const word = SEARCH_WORDS[i % SEARCH_WORDS.length];
    plan.push({ path: `/api/drummers?${new URLSearchParams(word ? { q: word } : { sort: 'rate' })}` });
    plan.push({ path: `/api/drummers/${drummerIds[(i * 37) % drummerIds.length]}` });
    const poll = i % polling.length;
    plan.push({ path: `/api/threads/${polling[poll].threadId}/messages`, headers: { cookie: cookies[poll] } });
    if (i % 2 === 0) plan.push({ path: `/api/drummers?${new URLSearchParams({ q: SEARCH_WORDS[(i + 3) % SEARCH_WORDS.length] || 'funk', style: 'funk' })}` });
    if (i % 3 === 0) plan.push({ path: `/api/drummers/${drummerIds[(i * 91) % drummerIds.length]}` });
    if (i % 2 === 1) plan.push({ path: `/api/threads/${polling[(poll + 1) % polling.length].threadId}/messages`, headers: { cookie: cookies[(poll + 1) % polling.length] } });
    if (i % 4 === 0) {
      const email = `drummer-${String(1 + ((i * 53) % 1000)).padStart(5, '0')}@${LARGE_EMAIL_DOMAIN}`;
      plan.push({ method: 'POST', path: '/api/auth/login', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: PASSWORD }) });
    }
  }
  return plan;
}

/**
 * Every request of the plan once, one after another, before the clock starts: a freshly started server
 * prepares its statements and fills SQLite's page cache on first use, and the run is about the steady state.
 */
async function warmUp(url: string, plan: AutocannonRequest[]): Promise<void> {
  for (const req of plan) {
    const res = await fetch(`${url}${req.path}`, { method: req.method ?? 'GET', headers: req.headers, body: req.body });
    await res.arrayBuffer();
  }
}

function percentile(sorted: number[], q: number): number {
  if (sorted.length === 0) return NaN;
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return Math.round(sorted[i] * 100) / 100;
}

/** `GET /api/drummers/:id`: ids and query strings dropped, so a table row is one route. */
export function routeShape(req: Pick<AutocannonRequest, 'method' | 'path'>): string {
  return `${req.method ?? 'GET'} ${req.path.replace(/[0-9a-f-]{36}/g, ':id').replace(/\?.*$/, '')}`;
}

export type RouteFigures = { requests: number; p50Ms: number; p99Ms: number; maxMs: number; timeouts: number };

/**
 * Starts connection i at its own place in the plan (i/connections of the way through). Left alone, all 100
 * connections walk the plan in step, so each sign-in in it arrives as a burst of 100 argon2 hashes at once —
 * a wave no real crowd makes, which showed as sign-ins of 3 s and more while the other routes stayed under 1 s.
 */
function staggered(planLength: number, connections: number): (client: AutocannonClient) => void {
  let next = 0;
  return (client) => {
    const skip = Math.floor((next++ * planLength) / connections) % planLength;
    for (let k = 0; k < skip; k++) client.requestIterator.nextRequest();
  };
}

/** One GET on a connection of its own (no keep-alive pool): it is accepted after every connection opened before it. */
function onFreshConnection(url: string): Promise<void> {
  return new Promise((res, rej) => {
    get(`${url}/api/health`, { agent: false }, (r) => r.resume().once('end', res)).once('error', rej);
  });
}

/**
 * Holds every connection's first request until all of them are open and accepted. libuv accepts one new
 * connection per turn of the event loop (libuv pull request 3696), so when 100 connections open at once and
 * the first few start sending at once, the server is busy with those while the rest wait a turn each —
 * under load a turn is 0.3–0.5 s, so the last waited past autocannon's 10 s timeout, reconnected at the back
 * of the queue and timed out again. Those were every timeout we saw; the run measures 100 open connections.
 */
function openAllFirst(url: string, connections: number): (client: AutocannonClient) => void {
  let connected = 0;
  let allConnected!: () => void;
  // A connection that fails to open must not hold the others for ever: it is an error of the run.
  const opened = new Promise<void>((res) => {
    allConnected = res;
    setTimeout(res, 10_000).unref();
  });
  // The accept queue is first in, first out: once a later connection is answered, every earlier one was accepted.
  // If the probe itself fails the run goes ahead: whatever is wrong then shows in its own figures.
  const go = opened.then(() => onFreshConnection(url)).catch(() => undefined);
  return (client) => {
    const send = client._doRequest.bind(client);
    let first = true;
    client._doRequest = () => {
      if (!first) return send();
      first = false;
      client.conn.once('connect', () => ++connected === connections && allConnected());
      void go.then(send);
    };
  };
}

export type SlowResponse = { shape: string; ms: number; answeredAtSec: number };
const SLOWEST_KEPT = 5;

/** Response times and timeouts per route shape, so a slow or failing run says which route it was. */
function routeRecorder() {
  const times = new Map<string, number[]>();
  const timeouts = new Map<string, number>();
  const started = performance.now();
  let slowest: SlowResponse[] = [];
  const shapeNow = (client: AutocannonClient) => client.requestIterator.currentRequest.shape ?? 'unknown';
  return {
    onResponse(client: AutocannonClient, ms: number): void {
      const shape = shapeNow(client);
      if (slowest.length < SLOWEST_KEPT || ms > slowest[slowest.length - 1].ms) {
        const answeredAtSec = Math.round((performance.now() - started) / 100) / 10;
        slowest = [...slowest, { shape, ms: Math.round(ms), answeredAtSec }].sort((a, b) => b.ms - a.ms).slice(0, SLOWEST_KEPT);
      }
      const list = times.get(shape) ?? [];
      if (list.length === 0) times.set(shape, list);
      list.push(ms);
    },
    watch(client: AutocannonClient): void {
      client.on('timeout', () => timeouts.set(shapeNow(client), (timeouts.get(shapeNow(client)) ?? 0) + 1));
    },
    slowest: () => slowest,
    figures(): Record<string, RouteFigures> {
      const shapes = [...new Set([...times.keys(), ...timeouts.keys()])].sort();
      return Object.fromEntries(
        shapes.map((shape) => {
          const sorted = [...(times.get(shape) ?? [])].sort((a, b) => a - b);
          return [shape, { requests: sorted.length, p50Ms: percentile(sorted, 0.5), p99Ms: percentile(sorted, 0.99), maxMs: sorted.at(-1) ?? NaN, timeouts: timeouts.get(shape) ?? 0 }];
        }),
      );
    },
  };
}

export type LoadBenchResult = {
  connections: number;
  durationSec: number;
  requests: number;
  requestsPerSec: number;
  p50Ms: number;
  p95Ms: number;
  p99Ms: number;
  errors: number;
  timeouts: number;
  rateLimited: number;
  otherNon2xx: number;
  statusCounts: Record<string, number>;
  nonOk: Record<string, { count: number; sample: string }>;
  routes: Record<string, RouteFigures>;
  /** The few slowest answers, with the second of the run they came back in: a stall shows as a cluster. */
  slowest: SlowResponse[];
  seedMs: number;
};

export async function runLoadBench(opts: { quick?: boolean; dataDir?: string; connections?: number } = {}): Promise<LoadBenchResult> {
  const dataDir = resolve(opts.dataDir ?? loadWorldDir());
  const { ms: seedMs } = await seedLoadWorld(dataDir);
  const { url, child } = await startServer(dataDir);
  try {
    // Every non-2xx answer is tallied by route shape and status, with one body kept, so a failed run says why.
    const nonOk: Record<string, { count: number; sample: string }> = {};
    const requests = (await trafficPlan(url, dataDir)).map((req) => ({
      ...req,
      shape: routeShape(req),
      onResponse: (status: number, body: string) => {
        if (status >= 200 && status < 300) return;
        const key = `${status} ${routeShape(req)}`;
        nonOk[key] ??= { count: 0, sample: String(body ?? '').slice(0, 200) };
        nonOk[key].count++;
      },
    }));
    await warmUp(url, requests);
    const connections = opts.connections ?? 100;
    const duration = opts.quick ? 5 : 30;
    // Every response time is kept so p95 is an exact percentile (autocannon's summary has p90 and p97.5, not p95).
    const times: number[] = [];
    const routes = routeRecorder();
    const stagger = staggered(requests.length, connections);
    const holdFirst = openAllFirst(url, connections);
    const setupClient = (client: AutocannonClient) => {
      stagger(client);
      routes.watch(client);
      holdFirst(client);
    };
    const tracker = autocannon({ url, connections, duration, requests, setupClient });
    tracker.on('response', (client, _status, _bytes, ms) => {
      times.push(ms);
      routes.onResponse(client, ms);
    });
    const r = await tracker;
    times.sort((a, b) => a - b);
    const statusCounts = Object.fromEntries(Object.entries(r.statusCodeStats ?? {}).map(([code, s]) => [code, s.count]));
    const rateLimited = statusCounts['429'] ?? 0;
    return {
      connections,
      durationSec: duration,
      requests: r.requests.total,
      requestsPerSec: Math.round(r.requests.average),
      p50Ms: percentile(times, 0.5),
      p95Ms: percentile(times, 0.95),
      p99Ms: percentile(times, 0.99),
      errors: r.errors,
      timeouts: r.timeouts,
      rateLimited,
      otherNon2xx: r.non2xx - rateLimited,
      statusCounts,
      nonOk,
      routes: routes.figures(),
      slowest: routes.slowest(),
      seedMs: Math.round(seedMs),
    };
  } finally {
    child.kill('SIGTERM');
    await new Promise((r) => child.once('exit', r));
  }
}

export const loadPassed = (r: LoadBenchResult) => r.errors === 0 && r.timeouts === 0 && r.otherNon2xx === 0;

const ms = (n: number) => `${Math.round(n)} ms`;

/** The figures as a few lines of text: the whole run, then one line per route shape, then every non-2xx. */
export function formatLoadReport(r: LoadBenchResult): string {
  const statuses = Object.entries(r.statusCounts).map(([code, n]) => `${code}×${n}`).join(', ');
  const lines = [
    `load: ${r.connections} connections × ${r.durationSec} s, ${r.requests} requests, ${r.requestsPerSec} req/s`,
    `  latency p50 ${ms(r.p50Ms)} / p95 ${ms(r.p95Ms)} / p99 ${ms(r.p99Ms)}`,
    `  errors (incl. timeouts) ${r.errors}, timeouts ${r.timeouts}, non-2xx ${r.otherNon2xx + r.rateLimited} (429: ${r.rateLimited}); statuses ${statuses || 'none'}`,
    `  world ready in ${(r.seedMs / 1000).toFixed(1)} s`,
    ...Object.entries(r.routes).map(([shape, f]) => `  ${shape.padEnd(36)} ${String(f.requests).padStart(5)} req  p50 ${ms(f.p50Ms)}  p99 ${ms(f.p99Ms)}  max ${ms(f.maxMs)}  timeouts ${f.timeouts}`),
    `  slowest: ${r.slowest.map((x) => `${x.shape} ${ms(x.ms)} at ${x.answeredAtSec} s`).join('; ')}`,
    ...Object.entries(r.nonOk).map(([key, v]) => `  non-2xx ${key}: ${v.count}× e.g. ${v.sample}`),
  ];
  return lines.join('\n');
}

if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  if (process.argv.includes('--serve')) {
    await serve(process.argv[process.argv.indexOf('--serve') + 1]);
  } else {
    const r = await runLoadBench({ quick: process.argv.includes('--quick') });
    console.log(formatLoadReport(r));
    console.log(loadPassed(r) ? 'zero errors: met' : 'errors: NOT met');
  }
}
