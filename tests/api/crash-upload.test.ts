// A stem upload cut off by a server crash, with real processes (issue 7). The server is killed with SIGKILL
// while a drummer's tus PATCH is still sending bytes. After a restart on the same data the client asks the
// server's offset (HEAD) and sends the rest: the stored original has the SHA-256 of the file the drummer
// has. A second upload the drummer never comes back for is removed by the abandoned-upload sweep, row and
// tus part alike, and the delivery's check then runs with the file that did arrive.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { and, eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { deliveryPaths } from '@shared/schemas/deliveries';
import { buildWav, renderKit } from '../../server/audio/testing/synth-wav';
import type { Db } from '../../server/db/client';
import { deliveryFiles, jobs } from '../../server/db/schema';
import { ABANDONED_UPLOADS_JOB } from '../../server/features/deliveries/abandoned-uploads';
import { insertBooking } from './helpers/money';
import { crashPerson, fundOverHttp, openDataDb } from './helpers/crash-world';
import { freePort, killAll, killHard, startApp, startPaymentsFakeProcess, tempDataDir, waitFor } from './helpers/processes';
import { addFile, tusCreate, tusOffset, tusPatch, tusTrickle } from './helpers/tus';

const data = tempDataDir();
let db: Db | undefined;

afterAll(async () => {
  await killAll();
  db?.$client.close();
  data.remove();
});

const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');
// Long enough (about 2.9 MB) that the kill lands while bytes are still coming.
const kit = renderKit({ sampleRate: 48_000, seconds: 20, tempo: 120, seed: 5 });
const stem = (name: string) => buildWav([kit.find((s) => s.name === name)!.samples], { sampleRate: 48_000, bits: 24 });
const partSize = (dir: string, fileId: string) => (existsSync(join(dir, fileId)) ? statSync(join(dir, fileId)).size : 0);

describe('crash recovery: a stem upload cut off by a killed server', () => {
  it('resumes from the server’s offset after a restart, and a deserted upload is swept without leftovers', async () => {
    const [appPort, paymentsPort] = [await freePort(), await freePort()];
    const base = `http://127.0.0.1:${appPort}`;
    const partsDir = join(data.dir, 'uploads-in-progress');
    await startPaymentsFakeProcess({ dataDir: data.dir, port: paymentsPort, appPort });
    let server = await startApp({ dataDir: data.dir, port: appPort, paymentsPort });
    const sql = openDataDb(data.dir);
    db = sql;

    const songwriter = await crashPerson(base, sql, { email: 'sw-crash-upload@kitlane.test', roles: ['songwriter'], displayName: 'Upload Songwriter' });
    const drummer = await crashPerson(base, sql, { email: 'dr-crash-upload@kitlane.test', roles: ['drummer'], displayName: 'Upload Drummer' });
    const bookingId = insertBooking(sql, { songwriterId: songwriter.id, drummerId: drummer.id });
    await fundOverHttp(sql, `http://127.0.0.1:${paymentsPort}`, songwriter, bookingId);
    const created = await drummer.client.post(deliveryPaths.list(bookingId), {});
    expect(created.status).toBe(201);
    const deliveryId = created.body.delivery.id as string;

    const kick = stem('Kick In.wav');
    const snare = stem('Snare Top.wav');
    const kickId = await addFile(drummer.client, deliveryId, 'Kick In.wav', kick.length);
    const snareId = await addFile(drummer.client, deliveryId, 'Snare Top.wav', snare.length);
    // The snare stops after a first piece and is never continued.
    const snareAt = await tusCreate(base, drummer.client, snareId, snare.length);
    expect((await tusPatch(base, drummer.client, snareAt, 0, snare.subarray(0, 100_000))).status).toBe(204);

    const kickAt = await tusCreate(base, drummer.client, kickId, kick.length);
    const trickle = tusTrickle(base, drummer.client, kickAt, kick);
    await waitFor('part of the kick on disk', () => (partSize(partsDir, kickId) >= 256 * 1024 ? true : null), 30_000, 20);
    await killHard(server);
    await trickle.done;
    const onDisk = partSize(partsDir, kickId);
    expect(onDisk).toBeGreaterThan(0);
    expect(onDisk).toBeLessThan(kick.length);

    server = await startApp({ dataDir: data.dir, port: appPort, paymentsPort });
    const head = await tusOffset(base, drummer.client, kickAt);
    expect(head.status).toBe(200);
    expect(head.offset).toBe(onDisk);
    const rest = await tusPatch(base, drummer.client, kickAt, head.offset!, kick.subarray(head.offset!));
    expect(rest.status).toBe(204);
    expect(rest.headers.get('upload-offset')).toBe(String(kick.length));

    const kickRow = sql.select().from(deliveryFiles).where(eq(deliveryFiles.id, kickId)).get()!;
    expect(kickRow).toMatchObject({ status: 'uploaded', sha256: sha256(kick) });
    expect(sha256(readFileSync(join(data.dir, 'files', kickRow.storageKey!)))).toBe(sha256(kick));
    // The finished upload leaves nothing behind in the tus folder.
    expect(readdirSync(partsDir).filter((n) => n.startsWith(kickId))).toEqual([]);

    // A day passes for the snare: restart with a short limit and let the hourly sweep come due now.
    await killHard(server);
    server = await startApp({ dataDir: data.dir, port: appPort, paymentsPort, env: { DELIVERY_ABANDONED_UPLOAD_HOURS: '0.0003' } });
    await new Promise((r) => setTimeout(r, 1500));
    sql.update(deliveryFiles).set({ createdAt: new Date(Date.now() - 3_600_000) }).where(eq(deliveryFiles.id, snareId)).run();
    const due = sql.update(jobs).set({ runAt: Date.now() }).where(and(eq(jobs.kind, ABANDONED_UPLOADS_JOB), eq(jobs.status, 'queued'))).returning({ id: jobs.id }).all();
    expect(due.length).toBeGreaterThan(0);
    await waitFor('the sweep to run', () => {
      const row = sql.select().from(jobs).where(eq(jobs.id, due[0].id)).get();
      return row?.status === 'done' ? row : null;
    }, 30_000);

    expect(sql.select().from(deliveryFiles).where(eq(deliveryFiles.id, snareId)).get()).toBeUndefined();
    expect(readdirSync(partsDir)).toEqual([]);
    expect((await tusOffset(base, drummer.client, snareAt)).status).toBe(404);
    expect(sql.select().from(deliveryFiles).where(eq(deliveryFiles.deliveryId, deliveryId)).all().map((f) => f.id)).toEqual([kickId]);
    const ready = await waitFor('the check without the swept file', async () => {
      const res = await drummer.client.get(deliveryPaths.one(deliveryId));
      return res.body.delivery?.status === 'ready' ? res.body.delivery : null;
    }, 90_000, 300);
    expect(ready.check.report.stems.map((s: { name: string }) => s.name)).toEqual(['Kick In.wav']);
    await killHard(server);
  }, 170_000);
});
