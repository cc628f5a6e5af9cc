import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { text } from 'node:stream/consumers';
import type { AddressInfo } from 'node:net';
// s3rver: a local S3-compatible server from the npm registry, used only in tests.
import S3rver from 's3rver';
import { createLocalStorage, type Storage } from './storage';
import { createS3Storage } from './s3-storage';

const dirs: string[] = [];
const tmp = (p: string) => {
  const d = mkdtempSync(join(tmpdir(), p));
  dirs.push(d);
  return d;
};

let s3server: { close(): Promise<void> } | null = null;
let s3: Storage;

beforeAll(async () => {
  const server = new S3rver({
    port: 0,
    address: '127.0.0.1',
    silent: true,
    directory: tmp('kitlane-s3-'),
    configureBuckets: [{ name: 'kitlane-test', configs: [] }],
  });
  const addr = (await server.run()) as AddressInfo;
  s3server = server;
  s3 = createS3Storage({
    endpoint: `http://127.0.0.1:${addr.port}`,
    bucket: 'kitlane-test',
    accessKeyId: 'S3RVER',
    secretAccessKey: 'S3RVER',
    partSizeBytes: 5 * 1024 * 1024,
  });
});

afterAll(async () => {
  await s3server?.close();
  for (const d of dirs) rmSync(d, { recursive: true, force: true });
});

// One contract, two drivers: the app can move its files to object storage by changing the driver only.
const drivers: Array<[string, () => Storage]> = [
  ['local disk', () => createLocalStorage(tmp('kitlane-local-'))],
  ['S3-compatible (s3rver)', () => s3],
];

describe.each(drivers)('storage driver: %s', (_name, make) => {
  it('stores a streamed body, reports its size, reads ranges and deletes', async () => {
    const storage = make();
    const body = Buffer.from('0123456789'.repeat(1000));
    const { size } = await storage.put('contract/a.bin', Readable.from([body.subarray(0, 4000), body.subarray(4000)]));
    expect(size).toBe(10_000);
    expect(await storage.stat('contract/a.bin')).toEqual({ size: 10_000 });
    expect(await text(storage.get('contract/a.bin', { start: 10, end: 19 }))).toBe('0123456789');
    expect((await text(storage.get('contract/a.bin'))).length).toBe(10_000);
    await storage.delete('contract/a.bin');
    expect(await storage.stat('contract/a.bin')).toBeNull();
  });

  it('streams a multipart-sized body without holding it whole', async () => {
    const storage = make();
    const chunk = Buffer.alloc(1024 * 1024, 7);
    const twelveMb = Readable.from((function* () {
      for (let i = 0; i < 12; i++) yield chunk;
    })());
    const { size } = await storage.put('contract/big.bin', twelveMb);
    expect(size).toBe(12 * 1024 * 1024);
  });

  it('refuses keys that could escape the store', async () => {
    const storage = make();
    await expect(storage.put('../etc/passwd', Readable.from(['x']))).rejects.toThrow(/invalid storage key/);
    expect(() => storage.get('a/../../b')).toThrow(/invalid storage key/);
  });

  it('leaves nothing behind when the body fails half-way', async () => {
    const storage = make();
    const failing = new Readable({
      read() {
        this.push(Buffer.alloc(64 * 1024, 1));
        this.destroy(new Error('client went away'));
      },
    });
    await expect(storage.put('contract/broken.bin', failing)).rejects.toThrow();
    expect(await storage.stat('contract/broken.bin')).toBeNull();
  });
});
