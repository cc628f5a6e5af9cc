// The authorization matrix: generated from the app's own route table. Every API route is called as
// anonymous, songwriter A and B, drummer A and B, engineer A and B and admin, on objects owned by each
// (the demo world, seeded through the services). A route without an entry in authz/access.ts fails here.
// Mutating routes are called by those who must be refused (signed out, wrong role, not a party); what a
// party may do is each feature's own API test, and calling it here would change the world under the matrix.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ApiClient, ApiResponse, TestApp } from './helpers/test-app';
import { DEMO_PEOPLE } from '../../server/db/demo-world';
import { apiRoutes, routeKey, type RouteEntry } from './authz/route-table';
import { ACCESS } from './authz/access';
import { firstId, paramTables } from './authz/params';
import { childOf, isPrivateTable, objectOf, partiesOf, privateObjects } from './authz/parties';
import { quiesceJobs, signInAs, startSeededApp } from './authz/world';

const PERSONAS = {
  songwriterA: 'mara@kitlane.test',
  songwriterB: 'teo@kitlane.test',
  drummerA: 'juno@kitlane.test',
  drummerB: 'odell@kitlane.test',
  engineerA: 'hollis@kitlane.test',
  engineerB: 'bea@kitlane.test',
  admin: 'admin@kitlane.test',
} as const;
type Persona = keyof typeof PERSONAS;
type Caller = { name: Persona | 'anonymous'; client: ApiClient; userId: string | null; email: string | null };

let app: TestApp;
let routes: RouteEntry[];
const callers: Caller[] = [];
let secrets: { table: string; id: string; parties: Set<string> }[] = [];
const allEmails = DEMO_PEOPLE.map((p) => p.email);
const failures: string[] = [];
const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);
// Input that no schema of the app accepts (the private query and body schemas are strict): a caller who must be
// refused gets 401/403 from the session check, never a 400 from parsing that ran first. The fuzz test sends
// such input signed in, where it must reach the schemas and answer in the error shape.
const STRAY_QUERY = '?stray=1';
const STRAY_BODY = { stray: true };

beforeAll(async () => {
  app = await startSeededApp();
  callers.push({ name: 'anonymous', client: app.client(), userId: null, email: null });
  for (const [name, email] of Object.entries(PERSONAS) as [Persona, string][]) {
    const client = await signInAs(app, email);
    const me = await client.get('/api/me');
    callers.push({ name, client, userId: me.body.user.id, email });
  }
  await quiesceJobs(app);
  routes = apiRoutes(app.kitlane.app);
  secrets = privateObjects(app.db);
}, 120_000);

afterAll(async () => {
  await app?.close();
});

const signedIn = () => callers.filter((c) => c.userId);

/** Fills the path: the first parameter with `primaryId` when given, later ones with rows of the same object. */
function fill(path: string, primaryId?: string | null): string {
  let out = path.replace('{/:id}', '/00000000-0000-4000-8000-000000000000');
  const params = paramTables(path.replace('{/:id}', ''));
  let parent: { table: string; id: string } | null = null;
  for (const p of params) {
    let value: string;
    if (!p.table) value = p.name === 'size' ? 'large' : 'pack_kit';
    else if (!parent && primaryId) value = primaryId;
    else value = (parent ? childOf(app.db, p.table, parent.table, parent.id) : null) ?? firstId(app.db, p.table) ?? '00000000-0000-4000-8000-000000000000';
    if (p.table && !parent) parent = { table: p.table, id: value };
    out = out.replace(`:${p.name}`, encodeURIComponent(value));
  }
  return out;
}

async function call(caller: Caller, route: RouteEntry, path: string, body: unknown = {}): Promise<ApiResponse> {
  const res = await caller.client.request(route.method, path, SAFE.has(route.method) ? undefined : body);
  const label = `${caller.name} ${route.method} ${path}`;
  if (res.status >= 500) failures.push(`${label} → ${res.status}`);
  leakCheck(caller, res, label);
  return res;
}

/** No answer to a non-admin names someone else's email or a private object the caller is not a party to. */
function leakCheck(caller: Caller, res: ApiResponse, label: string): void {
  if (caller.name === 'admin' || res.status >= 300) return;
  const text = typeof res.body === 'string' ? res.body : JSON.stringify(res.body ?? '');
  for (const email of allEmails) if (email !== caller.email && text.includes(email)) failures.push(`${label} leaks the email ${email}`);
  for (const s of secrets) {
    if (caller.userId && s.parties.has(caller.userId)) continue;
    if (text.includes(s.id)) failures.push(`${label} leaks ${s.table} ${s.id} (parties ${[...s.parties].join(',')})`);
  }
}

function flush(): void {
  const found = failures.splice(0);
  expect(found, found.join('\n')).toEqual([]);
}

describe('authorization matrix over the app route table', () => {
  it('has an access rule for every API route, and none for a route that is gone', () => {
    const keys = routes.map(routeKey);
    const missing = keys.filter((k) => !(k in ACCESS));
    const stale = Object.keys(ACCESS).filter((k) => !keys.includes(k));
    expect(missing, `routes without an entry in tests/api/authz/access.ts:\n${missing.join('\n')}`).toEqual([]);
    expect(stale, `entries for routes that no longer exist:\n${stale.join('\n')}`).toEqual([]);
    expect(routes.length).toBeGreaterThan(100);
  });

  it('turns the signed-out caller away (401) from every route that needs an account, and serves the public ones', async () => {
    const anon = callers[0];
    for (const route of routes) {
      const access = ACCESS[routeKey(route)];
      if (!access || access === 'anyone' || access === 'webhook') continue;
      if (route.method === 'OPTIONS') continue; // CORS/tus preflight carries no session by design
      if (access === 'public') {
        const res = await call(anon, route, fill(route.path));
        if (res.status === 401 || res.status === 403) failures.push(`anonymous ${routeKey(route)} (public) → ${res.status}`);
        continue;
      }
      for (const [input, path, body] of [['empty', fill(route.path), {}], ['stray', fill(route.path) + STRAY_QUERY, STRAY_BODY]] as const) {
        const res = await call(anon, route, path, body);
        if (res.status !== 401) failures.push(`anonymous ${routeKey(route)} (${access}, ${input} input) → ${res.status}, expected 401`);
      }
    }
    flush();
  }, 120_000);

  it('refuses the admin desk (403) to every signed-in role but admin, and opens it to the admin', async () => {
    for (const route of routes.filter((r) => ACCESS[routeKey(r)] === 'admin')) {
      const path = fill(route.path);
      for (const caller of signedIn()) {
        if (caller.name === 'admin') {
          if (!SAFE.has(route.method)) continue; // settling, disabling: the admin tests do these on purpose
          const res = await call(caller, route, path);
          if (res.status === 401 || res.status === 403) failures.push(`admin ${routeKey(route)} → ${res.status}`);
        } else {
          for (const [input, withQuery, body] of [['empty', path, {}], ['stray', path + STRAY_QUERY, STRAY_BODY]] as const) {
            const res = await call(caller, route, withQuery, body);
            if (res.status !== 403) failures.push(`${caller.name} ${routeKey(route)} (${input} input) → ${res.status}, expected 403`);
          }
        }
      }
    }
    flush();
  }, 120_000);

  it("keeps each party's bookings, deliveries, disputes, threads, messages and quotes from everyone else", async () => {
    const objectRoutes = routes.filter((r) => {
      const first = paramTables(r.path.replace('{/:id}', ''))[0];
      return ACCESS[routeKey(r)] === 'user' && first?.table && isPrivateTable(first.table);
    });
    expect(objectRoutes.length).toBeGreaterThan(20);
    let checked = 0;
    for (const route of objectRoutes) {
      const table = paramTables(route.path)[0].table!;
      const owners = new Set<string>();
      for (const owner of signedIn()) {
        const id = owner.name === 'admin' ? null : objectOf(app.db, table, owner.userId!);
        if (!id || owners.has(id)) continue;
        owners.add(id);
        const parties = partiesOf(app.db, table, id);
        const path = fill(route.path, id);
        for (const caller of signedIn()) {
          const isParty = parties.has(caller.userId!);
          if (isParty && !SAFE.has(route.method)) continue;
          const res = await call(caller, route, path);
          checked++;
          if (caller.name === 'admin') continue;
          if (!isParty && res.status < 400) failures.push(`${caller.name} (not a party) ${route.method} ${path} → ${res.status}`);
          if (!isParty && SAFE.has(route.method) && res.status !== 403 && res.status !== 404) failures.push(`${caller.name} (not a party) ${route.method} ${path} → ${res.status}, expected 403/404`);
          if (isParty && res.status === 401) failures.push(`${caller.name} (party) ${route.method} ${path} → 401`);
        }
      }
    }
    expect(checked).toBeGreaterThan(50);
    flush();
  }, 300_000);

  it('opens the main object pages to each of their parties', async () => {
    const pages: [string, string][] = [['/api/bookings/:id', 'bookings'], ['/api/deliveries/:id', 'deliveries'], ['/api/threads/:threadId/messages', 'threads'], ['/api/quotes/:id', 'quotes']];
    let opened = 0;
    for (const [path, table] of pages) {
      const route = { method: 'GET', path };
      for (const owner of signedIn()) {
        if (owner.name === 'admin') continue;
        const id = objectOf(app.db, table, owner.userId!);
        if (!id) continue;
        const res = await call(owner, route, fill(path, id));
        if (res.status !== 200) failures.push(`${owner.name} (party) GET ${fill(path, id)} → ${res.status}`);
        else opened++;
      }
    }
    expect(opened).toBeGreaterThan(4);
    flush();
  }, 120_000);

  it('answers every read-only route for every signed-in role without a 500 or a leak', async () => {
    for (const route of routes.filter((r) => r.method === 'GET')) {
      const path = fill(route.path);
      for (const caller of signedIn()) await call(caller, route, path);
    }
    flush();
  }, 300_000);
});
