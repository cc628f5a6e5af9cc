// Abandoned uploads (issue 5 follow-up): the hourly sweep job removes stems whose bytes stopped coming more
// than DELIVERY_ABANDONED_UPLOAD_HOURS ago, with their tus parts, and parts no unfinished file owns; an
// upload still being written is kept however old its row is, and the delivery's check then starts without
// the removed file. Age is made by moving timestamps back, the way a day passing would.
import { randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { utimes, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { deliveryPaths } from '@shared/schemas/deliveries';
import { buildWav, renderKit } from '../../server/audio/testing/synth-wav';
import { deliveryFiles, jobs } from '../../server/db/schema';
import { ABANDONED_UPLOADS_JOB } from '../../server/features/deliveries/abandoned-uploads';
import { startTestApp, type ApiClient, type TestApp } from './helpers/test-app';
import { fundBooking, insertBooking, person, waitUntil, type Person } from './helpers/money';

const HOUR = 3_600_000;
let app: TestApp;
let drummer: Person;
let deliveryId: string;
let partsDir: string;
const ids: Record<'stalled' | 'neverStarted' | 'moving' | 'done', string> = { stalled: '', neverStarted: '', moving: '', done: '' };

const kit = renderKit({ sampleRate: 48_000, seconds: 2, tempo: 120, seed: 11 });
const wav = (name: string) => buildWav([kit.find((s) => s.name === name)!.samples], { sampleRate: 48_000, bits: 24 });
const cookieOf = (client: ApiClient) => (client as unknown as { cookie: string }).cookie;

function tus(method: string, path: string, headers: Record<string, string>, body?: Buffer): Promise<Response> {
  return fetch(app.url + path, { method, headers: { cookie: cookieOf(drummer.client), 'Tus-Resumable': '1.0.0', ...headers }, body: body ? new Uint8Array(body) : undefined });
}

/** Adds a file and sends `sendBytes` of it over tus (all of them completes the upload). */
async function addFile(name: string, bytes: Buffer, sendBytes: number | null): Promise<{ id: string; location: string | null }> {
  const added = await drummer.client.post(deliveryPaths.files(deliveryId), { name, sizeBytes: bytes.length });
  expect(added.status).toBe(201);
  const id = added.body.file.id as string;
  if (sendBytes === null) return { id, location: null };
  const created = await tus('POST', deliveryPaths.uploads, { 'Upload-Length': String(bytes.length), 'Upload-Metadata': `fileId ${Buffer.from(id).toString('base64')}` });
  expect(created.status).toBe(201);
  const location = created.headers.get('location')!;
  const patched = await tus('PATCH', location, { 'Upload-Offset': '0', 'Content-Type': 'application/offset+octet-stream' }, bytes.subarray(0, sendBytes));
  expect(patched.status).toBe(204);
  return { id, location };
}

/** As if the row was made, and its part last written, `hours` ago. */
async function age(fileId: string, hours: { row: number; part?: number }): Promise<void> {
  app.db.update(deliveryFiles).set({ createdAt: new Date(Date.now() - hours.row * HOUR) }).where(eq(deliveryFiles.id, fileId)).run();
  if (hours.part === undefined) return;
  const then = new Date(Date.now() - hours.part * HOUR);
  for (const name of [fileId, `${fileId}.json`]) if (existsSync(join(partsDir, name))) await utimes(join(partsDir, name), then, then);
}

async function runSweep(): Promise<void> {
  const key = `test-sweep:${randomUUID()}`;
  app.kitlane.ctx.jobs.enqueue(ABANDONED_UPLOADS_JOB, {}, { dedupeKey: key });
  const job = await waitUntil('the sweep to run', () => {
    const row = app.db.select().from(jobs).where(eq(jobs.dedupeKey, key)).get();
    return row && (row.status === 'done' || row.status === 'failed') ? row : null;
  });
  expect(job.lastError).toBeNull();
  expect(job.status).toBe('done');
}

const fileRow = (id: string) => app.db.select().from(deliveryFiles).where(eq(deliveryFiles.id, id)).get();

beforeAll(async () => {
  app = await startTestApp();
  partsDir = join(app.dataDir, 'uploads-in-progress');
  const songwriter = await person(app, 'sw-sweep@kitlane.test', ['songwriter'], 'Sweep Songwriter');
  drummer = await person(app, 'dr-sweep@kitlane.test', ['drummer'], 'Sweep Drummer');
  const bookingId = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id });
  await fundBooking(app, songwriter, bookingId);
  const created = await drummer.client.post(deliveryPaths.list(bookingId), {});
  expect(created.status).toBe(201);
  deliveryId = created.body.delivery.id;

  const kick = wav('Kick In.wav');
  ids.done = (await addFile('Kick In.wav', kick, kick.length)).id;
  const snare = wav('Snare Top.wav');
  ids.stalled = (await addFile('Snare Top.wav', snare, 40_000)).id;
  ids.neverStarted = (await addFile('Snare Bottom.wav', wav('Snare Bottom.wav'), null)).id;
  const hat = wav('HH.wav');
  ids.moving = (await addFile('HH.wav', hat, 20_000)).id;
}, 60_000);

afterAll(async () => {
  await app?.close();
});

describe('the abandoned-upload sweep', () => {
  it('queues itself for the next hour when the app starts', () => {
    const queued = app.db.select().from(jobs).where(and(eq(jobs.kind, ABANDONED_UPLOADS_JOB), eq(jobs.status, 'queued'))).all();
    expect(queued).toHaveLength(1);
    expect(queued[0].runAt).toBeGreaterThan(Date.now());
    expect(queued[0].runAt).toBeLessThanOrEqual(Date.now() + HOUR);
  });

  it('leaves uploads younger than the limit alone', async () => {
    await age(ids.stalled, { row: 23, part: 23 });
    await runSweep();
    expect(fileRow(ids.stalled)?.status).toBe('uploading');
    expect(existsSync(join(partsDir, ids.stalled))).toBe(true);
  });

  it('removes a stalled upload and its tus part after 24 h without a byte, and one that never started', async () => {
    await age(ids.stalled, { row: 30, part: 25 });
    await age(ids.neverStarted, { row: 25 });
    await runSweep();
    expect(fileRow(ids.stalled)).toBeUndefined();
    expect(fileRow(ids.neverStarted)).toBeUndefined();
    expect(existsSync(join(partsDir, ids.stalled))).toBe(false);
    expect(existsSync(join(partsDir, `${ids.stalled}.json`))).toBe(false);
  });

  it('keeps an old upload whose part was written within the limit', async () => {
    await age(ids.moving, { row: 72, part: 2 });
    await runSweep();
    expect(fileRow(ids.moving)?.status).toBe('uploading');
    expect(existsSync(join(partsDir, ids.moving))).toBe(true);
  });

  it('removes old parts that no unfinished file owns, and keeps fresh ones', async () => {
    const oldOrphan = randomUUID();
    const freshOrphan = randomUUID();
    for (const id of [oldOrphan, freshOrphan]) {
      await writeFile(join(partsDir, id), Buffer.alloc(1024));
      await writeFile(join(partsDir, `${id}.json`), '{}');
    }
    const then = new Date(Date.now() - 48 * HOUR);
    await utimes(join(partsDir, oldOrphan), then, then);
    await utimes(join(partsDir, `${oldOrphan}.json`), then, then);
    await runSweep();
    expect(existsSync(join(partsDir, oldOrphan))).toBe(false);
    expect(existsSync(join(partsDir, `${oldOrphan}.json`))).toBe(false);
    expect(existsSync(join(partsDir, freshOrphan))).toBe(true);
    expect(existsSync(join(partsDir, ids.moving))).toBe(true);
  });

  it('lets the delivery be checked without the removed file once the rest is in', async () => {
    await age(ids.moving, { row: 72, part: 26 });
    await runSweep();
    expect(fileRow(ids.moving)).toBeUndefined();
    const ready = await waitUntil(
      'the check of the remaining file',
      async () => {
        const res = await drummer.client.get(deliveryPaths.one(deliveryId));
        return res.body.delivery?.status === 'ready' ? res.body.delivery : null;
      },
      60_000,
    );
    expect(ready.files.map((f: { id: string }) => f.id)).toEqual([ids.done]);
    expect(ready.check.report.stems).toHaveLength(1);
  });

  it('answers 404 to a client that comes back to resume a removed upload', async () => {
    const res = await tus('HEAD', `${deliveryPaths.uploads}/${ids.stalled}`, {});
    expect(res.status).toBe(404);
  });
});
