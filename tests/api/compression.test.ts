// Text answers go out gzip-compressed when the client asks; audio streams stay as they are so Range works.
import { request } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from './helpers/test-app';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp({ seed: true });
});
afterAll(async () => {
  await app.close();
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
