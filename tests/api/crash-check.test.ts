// The delivery check cut off by a server crash, with real processes (issue 7). The same three stems are
// delivered on two bookings: the first check runs undisturbed, the second server is killed with SIGKILL
// while its check job holds the lease. After the restart the check runs again to the end, stores exactly
// one result for the run, and reaches the same verdict as the undisturbed one.
import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { deliveryPaths } from '@shared/schemas/deliveries';
import { buildWav, renderKit } from '../../server/audio/testing/synth-wav';
import type { Db } from '../../server/db/client';
import { deliveries, deliveryChecks, jobs } from '../../server/db/schema';
import { CHECK_JOB } from '../../server/features/deliveries/deliveries.service';
import { insertBooking, type Person } from './helpers/money';
import { crashPerson, fundOverHttp, openDataDb } from './helpers/crash-world';
import { freePort, killAll, killHard, startApp, startPaymentsFakeProcess, tempDataDir, waitFor } from './helpers/processes';
import { addFile, tusCreate, tusPatch } from './helpers/tus';

const data = tempDataDir();
let db: Db | undefined;

afterAll(async () => {
  await killAll();
  db?.$client.close();
  data.remove();
});

// Long stems on one check thread, so the check takes long enough to be caught running.
const kit = renderKit({ sampleRate: 48_000, seconds: 20, tempo: 120, seed: 9 });
const NAMES = ['Kick In.wav', 'Snare Top.wav', 'Snare Bottom.wav'];
const STEMS = NAMES.map((name) => ({ name, bytes: buildWav([kit.find((s) => s.name === name)!.samples], { sampleRate: 48_000, bits: 24 }) }));

type Verdict = { level: string; summary: string; checks: { id: string; level: string }[]; stems: string[] };
const verdictOf = (report: { level: string; summary: string; checks: { id: string; level: string }[]; stems: { name: string }[] }): Verdict => ({
  level: report.level,
  summary: report.summary,
  checks: report.checks.map((c) => ({ id: c.id, level: c.level })),
  stems: report.stems.map((s) => s.name),
});

describe('crash recovery: the delivery check cut off by a killed server', () => {
  it('re-runs the check after a restart to the same verdict, with one stored result', async () => {
    const [appPort, paymentsPort] = [await freePort(), await freePort()];
    const base = `http://127.0.0.1:${appPort}`;
    const paymentsUrl = `http://127.0.0.1:${paymentsPort}`;
    const env = { DELIVERY_CHECK_THREADS: '1' };
    await startPaymentsFakeProcess({ dataDir: data.dir, port: paymentsPort, appPort });
    let server = await startApp({ dataDir: data.dir, port: appPort, paymentsPort, env });
    const sql = openDataDb(data.dir);
    db = sql;
    const songwriter = await crashPerson(base, sql, { email: 'sw-crash-check@kitlane.test', roles: ['songwriter'], displayName: 'Check Songwriter' });
    const drummer = await crashPerson(base, sql, { email: 'dr-crash-check@kitlane.test', roles: ['drummer'], displayName: 'Check Drummer' });

    async function deliver(who: Person): Promise<string> {
      const bookingId = insertBooking(sql, { songwriterId: songwriter.id, drummerId: who.id });
      await fundOverHttp(sql, paymentsUrl, songwriter, bookingId);
      const created = await who.client.post(deliveryPaths.list(bookingId), {});
      expect(created.status).toBe(201);
      const deliveryId = created.body.delivery.id as string;
      for (const s of STEMS) {
        const fileId = await addFile(who.client, deliveryId, s.name, s.bytes.length);
        const location = await tusCreate(base, who.client, fileId, s.bytes.length);
        expect((await tusPatch(base, who.client, location, 0, s.bytes)).status).toBe(204);
      }
      return deliveryId;
    }
    const readyReport = (deliveryId: string) =>
      waitFor('the delivery to be checked', async () => {
        const res = await drummer.client.get(deliveryPaths.one(deliveryId));
        return res.body.delivery?.status === 'ready' ? res.body.delivery.check.report : null;
      }, 120_000, 300);

    const undisturbed = verdictOf(await readyReport(await deliver(drummer)));

    const deliveryId = await deliver(drummer);
    const deliveryRow = () => sql.select().from(deliveries).where(eq(deliveries.id, deliveryId)).get()!;
    // Each upload that completes may queue a check run; the delivery's current run is the one that counts.
    const checkJob = () => sql.select().from(jobs).where(eq(jobs.dedupeKey, `delivery-check:${deliveryId}:${deliveryRow().checkRun}`)).get();
    await waitFor('the check to be running', () => {
      const job = checkJob();
      return job?.status === 'running' && deliveryRow().checkStatus === 'running' ? true : null;
    }, 60_000, 25);
    await killHard(server);

    // What the crash left: a job with a lease held by a dead process, no result.
    const cut = checkJob()!;
    expect(cut.status).toBe('running');
    expect(cut.lockedUntil).toBeGreaterThan(Date.now());
    expect(sql.select().from(deliveryChecks).where(eq(deliveryChecks.deliveryId, deliveryId)).all()).toEqual([]);

    server = await startApp({ dataDir: data.dir, port: appPort, paymentsPort, env });
    const rerun = verdictOf(await readyReport(deliveryId));
    expect(rerun).toEqual(undisturbed);
    expect(rerun.level).not.toBe('');
    const stored = sql.select().from(deliveryChecks).where(eq(deliveryChecks.deliveryId, deliveryId)).all();
    expect(stored).toHaveLength(1);
    expect(stored[0].run).toBe((cut.payload as { run: number }).run);
    const job = await waitFor('the check job to be done', () => {
      const row = checkJob();
      return row?.status === 'done' ? row : null;
    }, 10_000, 100);
    expect(job.kind).toBe(CHECK_JOB);
    expect(job.attempts).toBe(2);
    await killHard(server);
  }, 175_000);
});
