// Security basics of issue 7, checked against the running app and its own route table.
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ApiClient, TestApp } from './helpers/test-app';
import { DEMO_PEOPLE } from '../../server/db/demo-world';
import { apiRoutes, routeKey, type RouteEntry } from './authz/route-table';
import { fillPath } from './authz/params';
import { quiesceJobs, signInAs, startSeededApp } from './authz/world';

let app: TestApp;
let routes: RouteEntry[];
const people: { email: string; client: ApiClient }[] = [];

beforeAll(async () => {
  app = await startSeededApp();
  for (const p of DEMO_PEOPLE) people.push({ email: p.email, client: await signInAs(app, p.email) });
  await quiesceJobs(app);
  routes = apiRoutes(app.kitlane.app);
}, 120_000);

afterAll(async () => {
  await app?.close();
});

function scriptSrcOf(csp: string | null): string {
  return (csp ?? '').split(';').map((d) => d.trim()).find((d) => d.startsWith('script-src')) ?? '';
}

describe('content security policy', () => {
  it("sends a CSP whose script-src has neither 'unsafe-inline' nor 'unsafe-eval', on the app shell and the API", async () => {
    for (const path of ['/', '/drummers', '/api/health']) {
      const res = await fetch(app.url + path);
      const scriptSrc = scriptSrcOf(res.headers.get('content-security-policy'));
      expect(scriptSrc, path).toMatch(/^script-src 'self'/);
      expect(scriptSrc, path).not.toMatch(/unsafe-inline|unsafe-eval/);
      expect(res.headers.get('x-content-type-options'), path).toBe('nosniff');
    }
  });

  it('ships an HTML entry whose scripts all load from files (nothing inline for the CSP to refuse)', () => {
    const html = readFileSync('index.html', 'utf8');
    const scripts = html.match(/<script\b[^>]*>[\s\S]*?<\/script>/g) ?? [];
    expect(scripts.length).toBeGreaterThan(0);
    for (const s of scripts) expect(s, s).toMatch(/<script\b[^>]*\bsrc=/);
  });
});

describe('session cookie', () => {
  it('is HttpOnly, SameSite=Lax or Strict and scoped to the whole site', async () => {
    const res = await fetch(`${app.url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'mara@kitlane.test', password: 'kitlane-demo-pass' }) });
    expect(res.status).toBe(200);
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith('kitlane_session='));
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=(Lax|Strict)/i);
    expect(cookie).toMatch(/;\s*Path=\//i);
  });
});

describe('origin checks', () => {
  it('refuses every mutating API route from another origin with 403 cross_origin, before it does anything', async () => {
    const mutating = routes.filter((r) => ['POST', 'PUT', 'PATCH', 'DELETE'].includes(r.method));
    expect(mutating.length).toBeGreaterThan(30);
    const admin = people.find((p) => p.email === 'admin@kitlane.test')!.client;
    const refused: string[] = [];
    for (const route of mutating) {
      const path = fillPath(app.db, route.path).replace('{/:id}', '/x');
      for (const headers of [{ origin: 'https://elsewhere.test' }, { 'sec-fetch-site': 'cross-site' }] as Record<string, string>[]) {
        const res = await admin.request(route.method, path, {}, headers);
        if (res.status === 403 && res.body?.error?.code === 'cross_origin') refused.push(routeKey(route));
        else expect.fail(`${routeKey(route)} with ${JSON.stringify(headers)} answered ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`);
      }
    }
    expect(refused.length).toBe(mutating.length * 2);
  });

  it('still accepts a mutating request from the app origin itself', async () => {
    const res = await people[1].client.request('POST', '/api/notifications/read', {}, { origin: 'http://kitlane.test' });
    expect(res.status).toBeLessThan(400);
  });
});

describe('stored files', () => {
  it('serves every stored file it hands out with Content-Disposition and nosniff', async () => {
    const fileRoutes = routes.filter((r) => r.method === 'GET' && r.path.includes(':'));
    const served: string[] = [];
    for (const route of fileRoutes) {
      const path = fillPath(app.db, route.path);
      for (const { client } of [{ client: app.client() }, ...people]) {
        const res = await client.request('GET', path);
        const type = res.headers.get('content-type') ?? '';
        if (res.status !== 200 && res.status !== 206) continue;
        // JSON is the API's own output (waveform peaks included: numbers the server computed), not uploaded bytes.
        if (/^application\/json/.test(type)) continue;
        expect(res.headers.get('content-disposition') ?? '(none)', `${routeKey(route)} (${type})`).toMatch(/^(inline|attachment)/);
        expect(res.headers.get('x-content-type-options'), routeKey(route)).toBe('nosniff');
        served.push(routeKey(route));
        break;
      }
    }
    // The demo world has reels, guides and room photos; if none was served the check above checked nothing.
    expect(served.length).toBeGreaterThanOrEqual(2);
  });

  it('has no public folder of uploads or data: such paths answer with the app shell or 404, never a stored file', async () => {
    const db = readFileSync(`${app.dataDir}/kitlane.db`).subarray(0, 16).toString('latin1');
    expect(db).toBe('SQLite format 3\u0000');
    for (const path of ['/data/kitlane.db', '/kitlane.db', '/files/', '/data/files/', '/uploads/', '/uploads-in-progress/', '/api/files/x', '/api/data/kitlane.db', '/../kitlane.db', '/%2e%2e/kitlane.db', '/assets/..%2f..%2fkitlane.db']) {
      const res = await fetch(app.url + path);
      const text = await res.text();
      expect(text.startsWith('SQLite format 3'), path).toBe(false);
      expect(res.headers.get('content-type') ?? '', path).not.toMatch(/octet-stream|audio|image/);
    }
  });
});
