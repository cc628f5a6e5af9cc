// Text answers go out gzip-compressed when the client asks; audio streams stay as they are so Range works.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from './helpers/test-app';

// A stand-in for the built client: a shell and one hashed script, big enough to be worth compressing.
const dist = mkdtempSync(join(tmpdir(), 'kitlane-dist-'));
const SCRIPT = `export const parts = ${JSON.stringify(Array.from({ length: 400 }, (_, i) => ({ id: `part-${i}`, label: `Part ${i}` })))};\n`;

let app: TestApp;
beforeAll(async () => {
  mkdirSync(join(dist, 'assets'));
  writeFileSync(join(dist, 'index.html'), `<!doctype html><html><head><script type="module" src="/assets/index-test.js"></script></head><body><div id="root"></div>${'<!-- shell -->'.repeat(200)}</body></html>`);
  writeFileSync(join(dist, 'assets', 'index-test.js'), SCRIPT);
  app = await startTestApp({ seed: true, clientDist: dist });
});
afterAll(async () => {
  await app.close();
  rmSync(dist, { recursive: true, force: true });
});

/** A raw GET (fetch would decompress and hide the encoding) returning status, headers and body size. */
function rawGet(path: string, headers: Record<string, string>): Promise<{ status: number; headers: Record<string, string | string[] | undefined>; bytes: number }> {
  return new Promise((resolve, reject) => {
    const req = request(new URL(path, app.url), { headers }, (res) => {
      let bytes = 0;
      res.on('data', (d: Buffer) => (bytes += d.length));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, bytes }));
    });
    req.on('error', reject);
    req.end();
  });
}

describe('compression', () => {
  it('gzips a JSON list for a client that accepts gzip, and sends it plain to one that does not', async () => {
    const zipped = await rawGet('/api/drummers', { 'accept-encoding': 'gzip' });
    const plain = await rawGet('/api/drummers', {});
    expect(zipped.status).toBe(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(zipped.bytes).toBeLessThan(plain.bytes / 2);
  });

  it('gzips the client’s scripts and its page shell, which the static server also marks Accept-Ranges', async () => {
    const script = await rawGet('/assets/index-test.js', { 'accept-encoding': 'gzip' });
    expect(script.status).toBe(200);
    expect(script.headers['content-encoding']).toBe('gzip');
    expect(script.bytes).toBeLessThan(SCRIPT.length / 2);
    const shell = await rawGet('/deliveries/some-id', { 'accept-encoding': 'gzip' });
    expect(shell.status).toBe(200);
    expect(shell.headers['content-encoding']).toBe('gzip');
  });

  it('leaves a reel’s audio uncompressed so a Range request gets its exact bytes', async () => {
    const list = (await (await fetch(new URL('/api/drummers', app.url))).json()) as { items: { id: string }[] };
    let trackId: string | null = null;
    for (const d of list.items) {
      const page = (await (await fetch(new URL(`/api/drummers/${d.id}`, app.url))).json()) as { drummer?: { reelTracks?: { id: string }[] } };
      trackId = page.drummer?.reelTracks?.[0]?.id ?? null;
      if (trackId) break;
    }
    expect(trackId).not.toBeNull();
    const part = await rawGet(`/api/reel-tracks/${trackId}/audio`, { 'accept-encoding': 'gzip', range: 'bytes=0-99' });
    expect(part.status).toBe(206);
    expect(part.headers['content-encoding']).toBeUndefined();
    expect(part.bytes).toBe(100);
  });
});
