// Input fuzzing over the app's own route table: fast-check sends arbitrary and boundary bodies (and query
// strings) to every JSON route as a signed-in user of the role the route is for. Whatever arrives, the answer
// is below 500 and, when it is an error, has the `{error:{code,message}}` shape and changed no row.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { TestApp, ApiClient } from './helpers/test-app';
import { apiRoutes, routeKey, type RouteEntry } from './authz/route-table';
import { dbChecksum, fillPath } from './authz/params';
import { quiesceJobs, signInAs, startSeededApp } from './authz/world';
import { createCheckPool } from '../../server/audio/pool';
import { buildWav, sine } from '../../server/audio/testing/synth-wav';

const RUNS_PER_ROUTE = 20;

// Not JSON routes: the resumable-upload protocol (tus, binary PATCH bodies) and signing out (ends the
// session the rest of the run needs). Both have their own tests.
const NOT_FUZZED = (r: RouteEntry) => r.path.startsWith('/api/uploads') || r.path === '/api/auth/logout';

// Field names the app's schemas use, so generated objects reach past "unknown object" into each field's rules.
const FIELDS = ['email', 'password', 'newPassword', 'currentPassword', 'displayName', 'roles', 'token', 'songTitle', 'description', 'tempoBpm', 'lengthBars', 'budgetMinMinor', 'budgetMaxMinor', 'currency', 'deadline', 'timeZone', 'lineItems', 'revisionsIncluded', 'turnaroundDays', 'body', 'ids', 'name', 'dimensions', 'surfaces', 'inputs', 'dayRateMinor', 'channels', 'priceMinor', 'amountMinor', 'reason', 'outcome', 'note', 'rating', 'text', 'status', 'dates', 'done', 'order', 'kinds', 'muted', 'headline', 'styles', 'baseRateMinor', 'drummerIds', 'mode', 'files', 'size', 'sha256', 'q', 'page', '__proto__', 'constructor'];

const boundaryNumber = fc.oneof(
  fc.constantFrom(0, -1, 1, -0, 2 ** 31, -(2 ** 31), 2 ** 53, Number.MAX_SAFE_INTEGER + 2, 1e308, -1e308, 5e-324, 0.1, 1.5),
  fc.integer(),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
);
const boundaryString = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  fc.constantFrom('', ' ', '\u0000', '\u202e', '😀'.repeat(500), 'a'.repeat(20_000), '../../etc/passwd', '<script>alert(1)</script>', "' OR 1=1 --", '2026-02-30', 'NaN', '-1', 'null', 'USD', 'usd', 'XXX'),
);
const leaf = fc.oneof(boundaryNumber, boundaryString, fc.boolean(), fc.constant(null));
const value = fc.oneof({ depthSize: 'small' }, leaf, fc.array(leaf, { maxLength: 5 }), fc.dictionary(fc.constantFrom(...FIELDS), leaf, { maxKeys: 4 }));
const body = fc.oneof(
  fc.dictionary(fc.constantFrom(...FIELDS), value, { maxKeys: 8 }),
  fc.dictionary(fc.string({ maxLength: 12 }), value, { maxKeys: 5 }),
  fc.jsonValue({ maxDepth: 3 }),
  fc.anything({ maxDepth: 2 }).map((v) => JSON.parse(JSON.stringify(v ?? null) ?? 'null') as unknown),
);
const rawText = fc.oneof(fc.constantFrom('{', '{"a":', '[1,2', 'nul', '{"__proto__":{"admin":true}}'), fc.string({ maxLength: 60 }));
const query = fc.dictionary(fc.constantFrom(...FIELDS, 'sort', 'style', 'maxRate', 'tzBand', 'cursor', 'limit'), fc.oneof(boundaryString, boundaryNumber.map(String)), { maxKeys: 5 });

type Who = 'songwriter' | 'drummer' | 'engineer' | 'admin';
const DEMO: Record<Who, string> = { songwriter: 'mara@kitlane.test', drummer: 'juno@kitlane.test', engineer: 'hollis@kitlane.test', admin: 'admin@kitlane.test' };

/** The role a route is for, from its path: who would send this request in the product. */
function roleFor(path: string): Who {
  if (path.startsWith('/api/admin')) return 'admin';
  if (/^\/api\/(rooms|mic-packages|profile\/engineer|payouts)/.test(path)) return 'engineer';
  if (/^\/api\/(quotes|reel-tracks|profile\/drummer|deliveries)/.test(path) || /\/quotes$/.test(path) && path.startsWith('/api/briefs/:id/quotes')) return 'drummer';
  return 'songwriter';
}

const isErrorShape = (b: unknown) => {
  const e = (b as { error?: { code?: unknown; message?: unknown } } | null)?.error;
  return typeof e?.code === 'string' && typeof e?.message === 'string';
};

let app: TestApp;
const clients = {} as Record<Who, ApiClient>;
let routes: RouteEntry[] = [];

beforeAll(async () => {
  app = await startSeededApp();
  for (const who of Object.keys(DEMO) as Who[]) clients[who] = await signInAs(app, DEMO[who]);
  await quiesceJobs(app);
  routes = apiRoutes(app.kitlane.app).filter((r) => !NOT_FUZZED(r));
}, 120_000);

afterAll(async () => {
  await app?.close();
});

type Outcome = { status: number; body: unknown };

/** Sends one request; a 2xx means the input happened to be valid, so the baseline moves on with it. */
async function probe(send: () => Promise<Outcome>, state: { sum: string }, label: string): Promise<void> {
  const res = await send();
  expect(res.status, `${label} → ${res.status} ${JSON.stringify(res.body).slice(0, 300)}`).toBeLessThan(500);
  const after = dbChecksum(app.db);
  // 414/431 come from Node's HTTP parser (request line or headers over its limit) before the app sees anything.
  if (res.status >= 400 && res.status !== 414 && res.status !== 431) {
    expect(isErrorShape(res.body), `${label}: error shape, got ${JSON.stringify(res.body).slice(0, 200)}`).toBe(true);
    expect(after === state.sum, `${label} → ${res.status} but rows changed`).toBe(true);
  }
  state.sum = after;
}

describe('input fuzzing over every JSON route', () => {
  it('finds the JSON routes in the app route table', () => {
    const mutating = routes.filter((r) => ['POST', 'PUT', 'PATCH'].includes(r.method));
    expect(mutating.length).toBeGreaterThan(30);
  });

  it('answers arbitrary bodies on every POST/PUT/PATCH route with a 4xx in the error shape and no changed row', async () => {
    const state = { sum: dbChecksum(app.db) };
    for (const route of routes.filter((r) => ['POST', 'PUT', 'PATCH'].includes(r.method))) {
      const client = clients[roleFor(route.path)];
      const path = fillPath(app.db, route.path);
      await fc.assert(
        fc.asyncProperty(body, async (b) => probe(() => client.request(route.method, path, b ?? null), state, `${routeKey(route)} ${JSON.stringify(b)?.slice(0, 120)}`)),
        { numRuns: RUNS_PER_ROUTE },
      );
      await fc.assert(
        fc.asyncProperty(rawText, async (t) => probe(() => client.request(route.method, path, t, { 'content-type': 'application/json' }), state, `${routeKey(route)} raw ${JSON.stringify(t)}`)),
        { numRuns: 4 },
      );
    }
  }, 600_000);

  it('answers arbitrary query strings and ids on every GET route without a 500', async () => {
    const state = { sum: dbChecksum(app.db) };
    for (const route of routes.filter((r) => r.method === 'GET')) {
      const client = clients[roleFor(route.path)];
      const path = fillPath(app.db, route.path);
      await fc.assert(
        fc.asyncProperty(query, async (q) => {
          const qs = new URLSearchParams(q as Record<string, string>).toString();
          await probe(() => client.get(qs ? `${path}?${qs}` : path), state, `${routeKey(route)} ?${qs.slice(0, 120)}`);
        }),
        { numRuns: 8 },
      );
      if (path.includes('/:') || route.path.includes(':')) {
        const weird = ['x', '%00', '..%2F..%2Fkitlane.db', 'a'.repeat(2000), '-1', '😀'];
        for (const id of weird) {
          const bent = route.path.replace(/:(\w+)/g, id);
          await probe(() => client.get(bent), state, `${routeKey(route)} with id ${id.slice(0, 20)}`);
        }
      }
    }
  }, 600_000);
});

// ---------------------------------------------------------------- the WAV reader

describe('WAV reader under mutated and random bytes', () => {
  const WAV_CODES = ['not-wav', 'truncated', 'unsupported', 'malformed', 'io'];
  const PER_FILE_MS = 10_000;

  /** Byte offsets of every chunk-size field in a RIFF file (after the 'RIFF' tag and each chunk id). */
  function sizeFieldOffsets(buf: Buffer): number[] {
    const out = [4];
    for (let at = 12; at + 8 <= buf.length; ) {
      out.push(at + 4);
      const size = buf.readUInt32LE(at + 4);
      at += 8 + size + (size % 2);
    }
    return out;
  }

  const mutation = fc.oneof(
    fc.record({ kind: fc.constant('truncate' as const), at: fc.nat() }),
    fc.record({ kind: fc.constant('size' as const), which: fc.nat(), value: fc.constantFrom(0xffffffff, 0xfffffffe, 0, 1, 0x7fffffff, 3) }),
    fc.record({ kind: fc.constant('flip' as const), at: fc.nat(), byte: fc.integer({ min: 0, max: 255 }) }),
    fc.record({ kind: fc.constant('junk' as const), at: fc.nat(), bytes: fc.uint8Array({ maxLength: 64 }) }),
    fc.record({ kind: fc.constant('nested' as const), depth: fc.integer({ min: 1, max: 40 }) }),
    fc.record({ kind: fc.constant('random' as const), bytes: fc.uint8Array({ maxLength: 4096 }) }),
  );

  it('answers each broken file with a clear error or a report, in bounded time and memory, and the pool keeps working', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kitlane-wav-fuzz-'));
    const pool = createCheckPool({ maxThreads: 2 });
    const valid = buildWav([sine({ sampleRate: 48_000, seconds: 0.5, freq: 440, amplitude: 0.5 })], { sampleRate: 48_000, bits: 24 });
    const rssBefore = process.memoryUsage().rss;
    let n = 0;
    try {
      await fc.assert(
        fc.asyncProperty(mutation, async (m) => {
          let buf = Buffer.from(valid);
          if (m.kind === 'truncate') buf = buf.subarray(0, m.at % buf.length);
          if (m.kind === 'size') {
            const offsets = sizeFieldOffsets(valid);
            buf.writeUInt32LE(m.value, offsets[m.which % offsets.length]);
          }
          if (m.kind === 'flip') buf[m.at % buf.length] = m.byte;
          if (m.kind === 'junk') buf = Buffer.concat([buf.subarray(0, m.at % buf.length), Buffer.from(m.bytes), buf.subarray(m.at % buf.length)]);
          if (m.kind === 'nested') {
            // LIST chunks inside LIST chunks, each claiming to hold the rest of the file.
            const nest = Buffer.concat(Array.from({ length: m.depth }, () => Buffer.from('LIST\xff\xff\xff\x7fINFO', 'latin1')));
            buf = Buffer.concat([buf.subarray(0, 12), nest, buf.subarray(12)]);
          }
          if (m.kind === 'random') buf = Buffer.from(m.bytes);
          const path = join(dir, `f${n++}.wav`);
          writeFileSync(path, buf);
          let timer: NodeJS.Timeout | undefined;
          const timeout = new Promise<never>((_, reject) => {
            timer = setTimeout(() => reject(new Error(`no answer in ${PER_FILE_MS} ms for ${m.kind}`)), PER_FILE_MS);
          });
          const result = await Promise.race([pool.run({ path, name: 'fuzz.wav', part: null }), timeout]).finally(() => clearTimeout(timer));
          if (!result.ok) {
            expect(WAV_CODES, `${m.kind}: ${result.code} ${result.reason}`).toContain(result.code);
            expect(result.reason.length).toBeGreaterThan(5);
          }
        }),
        { numRuns: 60 },
      );
      writeFileSync(join(dir, 'ok.wav'), valid);
      const after = await pool.run({ path: join(dir, 'ok.wav'), name: 'ok.wav', part: null });
      expect(after.ok).toBe(true);
      expect(process.memoryUsage().rss - rssBefore).toBeLessThan(300 * 1024 * 1024);
    } finally {
      await pool.destroy();
      rmSync(dir, { recursive: true, force: true });
    }
  }, 300_000);
});
