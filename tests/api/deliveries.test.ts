// Stem deliveries (issue 5): creating a delivery, resumable tus uploads (one cut off and resumed), the check
// job and its report, submit gating, notes, request changes, accept (release), previews, originals and the
// zip with its manifest; every route with the wrong user.
import { createHash } from 'node:crypto';
import { inflateRawSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { deliveryPaths } from '@shared/schemas/deliveries';
import { buildWav, renderKit } from '../../server/audio/testing/synth-wav';
import { deliveries, jobs } from '../../server/db/schema';
import { startTestApp, type ApiClient, type TestApp } from './helpers/test-app';
import { bookingStatus, fundBooking, insertBooking, person, waitUntil, type Person } from './helpers/money';

let app: TestApp;
let songwriter: Person;
let drummer: Person;
let outsider: Person;
let admin: Person;

const cookieOf = (client: ApiClient) => (client as unknown as { cookie: string }).cookie;
const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

// Three drum-like stems of 3 s at the brief's 48 kHz / 24-bit; the snare pair is inverted by design.
const kit = renderKit({ sampleRate: 48_000, seconds: 3, tempo: 120, seed: 7 });
const stem = (name: string) => buildWav([kit.find((s) => s.name === name)!.samples], { sampleRate: 48_000, bits: 24 });
const STEMS = { 'Kick In.wav': stem('Kick In.wav'), 'Snare Top.wav': stem('Snare Top.wav'), 'Snare Bottom.wav': stem('Snare Bottom.wav') };

// ── tus, spoken by hand so the protocol steps are visible ────────────────────────────────────────────
const b64 = (s: string) => Buffer.from(s).toString('base64');

async function tusCreate(client: ApiClient, fileId: string, size: number, name = 'x.wav'): Promise<Response> {
  return fetch(app.url + deliveryPaths.uploads, {
    method: 'POST',
    headers: { cookie: cookieOf(client), 'Tus-Resumable': '1.0.0', 'Upload-Length': String(size), 'Upload-Metadata': `fileId ${b64(fileId)},filename ${b64(name)}` },
  });
}

async function tusPatch(client: ApiClient, location: string, offset: number, body: Buffer): Promise<Response> {
  return fetch(app.url + location, {
    method: 'PATCH',
    headers: { cookie: cookieOf(client), 'Tus-Resumable': '1.0.0', 'Upload-Offset': String(offset), 'Content-Type': 'application/offset+octet-stream' },
    body: new Uint8Array(body),
  });
}

async function tusOffset(client: ApiClient, location: string): Promise<number> {
  const res = await fetch(app.url + location, { method: 'HEAD', headers: { cookie: cookieOf(client), 'Tus-Resumable': '1.0.0' } });
  if (res.status !== 200) throw new Error(`HEAD ${res.status}`);
  return Number(res.headers.get('upload-offset'));
}

/** Sends `bytes` as a stream and cuts the connection after `cutAfter` bytes, like a dropped network. */
async function tusPatchCut(client: ApiClient, location: string, bytes: Buffer, cutAfter: number): Promise<void> {
  const controller = new AbortController();
  let sent = 0;
  const body = new ReadableStream<Uint8Array>({
    async pull(c) {
      if (sent >= cutAfter) {
        // Give the server a moment to write what it received, then drop the connection.
        await new Promise((r) => setTimeout(r, 150));
        controller.abort();
        return;
      }
      const chunk = bytes.subarray(sent, Math.min(cutAfter, sent + 64 * 1024));
      sent += chunk.length;
      c.enqueue(new Uint8Array(chunk));
    },
  });
  await fetch(app.url + location, {
    method: 'PATCH',
    headers: { cookie: cookieOf(client), 'Tus-Resumable': '1.0.0', 'Upload-Offset': '0', 'Content-Type': 'application/offset+octet-stream' },
    body,
    signal: controller.signal,
    duplex: 'half',
  } as RequestInit).catch(() => undefined);
}

async function addAndUpload(client: ApiClient, deliveryId: string, name: string, bytes: Buffer): Promise<string> {
  const added = await client.post(deliveryPaths.files(deliveryId), { name, sizeBytes: bytes.length });
  expect(added.status).toBe(201);
  const created = await tusCreate(client, added.body.file.id, bytes.length, name);
  expect(created.status).toBe(201);
  const done = await tusPatch(client, created.headers.get('location')!, 0, bytes);
  expect(done.status).toBe(204);
  return added.body.file.id as string;
}

async function waitReady(client: ApiClient, deliveryId: string) {
  return waitUntil(
    'the delivery to be checked',
    async () => {
      const res = await client.get(deliveryPaths.one(deliveryId));
      return res.body.delivery?.status === 'ready' ? res.body.delivery : null;
    },
    60_000,
  );
}

async function fundedBooking(spec: { revisionsIncluded?: number } = {}): Promise<string> {
  const id = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id, revisionsIncluded: spec.revisionsIncluded ?? 1 });
  await fundBooking(app, songwriter, id);
  return id;
}

beforeAll(async () => {
  app = await startTestApp();
  songwriter = await person(app, 'sw-deliv@kitlane.test', ['songwriter'], 'Ines Songwriter');
  drummer = await person(app, 'dr-deliv@kitlane.test', ['drummer'], 'Tomas Drummer');
  outsider = await person(app, 'out-deliv@kitlane.test', ['drummer'], 'Other Drummer');
  admin = await person(app, 'ad-deliv@kitlane.test', ['songwriter'], 'Desk Admin');
  app.db.$client.prepare(`update users set roles = '["admin"]' where id = ?`).run(admin.id);
}, 60_000);

afterAll(async () => {
  await app?.close();
});

describe('a delivery from upload to acceptance', () => {
  let bookingId: string;
  let deliveryId: string;
  const fileIds: Record<string, string> = {};

  it('lets the drummer open v1 on a funded booking, which moves it to recording', async () => {
    bookingId = await fundedBooking();
    const res = await drummer.client.post(deliveryPaths.list(bookingId), { note: 'First pass, all mics.' });
    expect(res.status).toBe(201);
    expect(res.body.delivery).toMatchObject({ number: 1, status: 'uploading', note: 'First pass, all mics.' });
    deliveryId = res.body.delivery.id;
    expect(bookingStatus(app.db, bookingId)).toBe('recording');
  });

  it('refuses a second open delivery while v1 is not submitted', async () => {
    const res = await drummer.client.post(deliveryPaths.list(bookingId), {});
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('cannot_deliver');
  });

  it('suggests a part from each file name and refuses a non-WAV name with a field error', async () => {
    const bad = await drummer.client.post(deliveryPaths.files(deliveryId), { name: 'notes.txt', sizeBytes: 10 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('name');
    const res = await drummer.client.post(deliveryPaths.files(deliveryId), { name: 'Snare Bottom.wav', sizeBytes: STEMS['Snare Bottom.wav'].length });
    expect(res.status).toBe(201);
    expect(res.body.file).toMatchObject({ part: 'snare_bottom', suggestedPart: 'snare_bottom', status: 'uploading', sha256: null });
    fileIds['Snare Bottom.wav'] = res.body.file.id;
  });

  it('resumes an upload that was cut off, and the SHA-256 covers the whole file', async () => {
    const bytes = STEMS['Snare Bottom.wav'];
    const created = await tusCreate(drummer.client, fileIds['Snare Bottom.wav'], bytes.length);
    expect(created.status).toBe(201);
    const location = created.headers.get('location')!;
    expect(location).toBe(`/api/uploads/${fileIds['Snare Bottom.wav']}`);
    await tusPatchCut(drummer.client, location, bytes, Math.floor(bytes.length / 2));
    const offset = await waitUntil('the server to settle the cut upload', async () => {
      const o = await tusOffset(drummer.client, location);
      return o > 0 ? o : null;
    });
    expect(offset).toBeGreaterThan(0);
    expect(offset).toBeLessThan(bytes.length);
    // Nothing partial is shown: the file is still uploading, without a hash.
    const midway = await drummer.client.get(deliveryPaths.one(deliveryId));
    expect(midway.body.delivery.files[0]).toMatchObject({ status: 'uploading', sha256: null });
    const rest = await tusPatch(drummer.client, location, offset, bytes.subarray(offset));
    expect(rest.status).toBe(204);
    expect(rest.headers.get('upload-offset')).toBe(String(bytes.length));
    const after = await drummer.client.get(deliveryPaths.one(deliveryId));
    expect(after.body.delivery.files[0]).toMatchObject({ status: 'uploaded', sha256: sha256(bytes) });
  });

  it('answers 404 to an outsider on every tus step and 401 without a session', async () => {
    const res = await drummer.client.post(deliveryPaths.files(deliveryId), { name: 'Kick In.wav', sizeBytes: STEMS['Kick In.wav'].length });
    fileIds['Kick In.wav'] = res.body.file.id;
    const foreign = await tusCreate(outsider.client, res.body.file.id, STEMS['Kick In.wav'].length);
    expect(foreign.status).toBe(404);
    const anonymous = await fetch(app.url + deliveryPaths.uploads, { method: 'POST', headers: { 'Tus-Resumable': '1.0.0', 'Upload-Length': '10', 'Upload-Metadata': `fileId ${b64(res.body.file.id)}` } });
    expect(anonymous.status).toBe(401);
    const created = await tusCreate(drummer.client, res.body.file.id, STEMS['Kick In.wav'].length);
    const location = created.headers.get('location')!;
    const head = await fetch(app.url + location, { method: 'HEAD', headers: { cookie: cookieOf(outsider.client), 'Tus-Resumable': '1.0.0' } });
    expect(head.status).toBe(404);
    const patch = await tusPatch(outsider.client, location, 0, STEMS['Kick In.wav']);
    expect(patch.status).toBe(404);
    expect((await tusPatch(drummer.client, location, 0, STEMS['Kick In.wav'])).status).toBe(204);
  });

  it('refuses an upload whose length differs from the announced size', async () => {
    const res = await drummer.client.post(deliveryPaths.files(deliveryId), { name: 'Snare Top.wav', sizeBytes: STEMS['Snare Top.wav'].length });
    fileIds['Snare Top.wav'] = res.body.file.id;
    const wrong = await tusCreate(drummer.client, res.body.file.id, STEMS['Snare Top.wav'].length + 1);
    expect(wrong.status).toBe(400);
    const created = await tusCreate(drummer.client, res.body.file.id, STEMS['Snare Top.wav'].length);
    expect((await tusPatch(drummer.client, created.headers.get('location')!, 0, STEMS['Snare Top.wav'])).status).toBe(204);
  });

  it('runs the check as a job once every file is in, with the brief’s expectations and peaks per stem', async () => {
    const ready = await waitReady(drummer.client, deliveryId);
    expect(ready.check.status).toBe('done');
    const report = ready.check.report;
    expect(report.stems).toHaveLength(3);
    expect(report.summary).toMatch(/^3 stems, 48 kHz \/ 24-bit/);
    expect(report.summary).toMatch(/snare bottom inverted against snare top/);
    expect(report.checks.find((c: { id: string }) => c.id === 'sample-rate')).toMatchObject({ level: 'pass' });
    // The server's own paths never leave it.
    expect(report.stems.every((s: { file: string; name: string }) => s.file === s.name)).toBe(true);
    expect(ready.files.every((f: { hasPeaks: boolean; previewStatus: string }) => f.hasPeaks && f.previewStatus === 'ready')).toBe(true);
    const peaks = await drummer.client.get(deliveryPaths.peaks(deliveryId, fileIds['Kick In.wav']));
    expect(peaks.status).toBe(200);
    expect(peaks.body.levels.map((l: { samplesPerPixel: number }) => l.samplesPerPixel)).toEqual([256, 4096]);
    expect(peaks.body.durationSec).toBeCloseTo(3, 3);
    const preview = await fetch(app.url + deliveryPaths.preview(deliveryId, fileIds['Kick In.wav']), { headers: { cookie: cookieOf(drummer.client), range: 'bytes=0-3' } });
    expect(preview.status).toBe(206);
    expect(preview.headers.get('content-type')).toBe('audio/mpeg');
    const head = Buffer.from(await preview.arrayBuffer());
    // An MPEG audio frame starts with 11 set sync bits.
    expect(head[0]).toBe(0xff);
    expect(head[1] & 0xe0).toBe(0xe0);
    // The runner marks a job done just after its handler returns, so the row may trail the delivery by a moment.
    await expect
      .poll(() => app.db.select().from(jobs).where(eq(jobs.kind, 'deliveries.check')).all().every((j) => j.status === 'done'), { timeout: 5_000, interval: 50 })
      .toBe(true);
  }, 90_000);

  it('keeps an unsubmitted delivery hidden from the songwriter and outsiders', async () => {
    expect((await songwriter.client.get(deliveryPaths.one(deliveryId))).status).toBe(404);
    expect((await outsider.client.get(deliveryPaths.one(deliveryId))).status).toBe(404);
    expect((await songwriter.client.get(deliveryPaths.list(bookingId))).body.items).toHaveLength(0);
    expect((await outsider.client.get(deliveryPaths.list(bookingId))).status).toBe(404);
  });

  it('lets only the uploader submit, then tells the songwriter and the booking is delivered', async () => {
    expect((await outsider.client.post(deliveryPaths.submit(deliveryId))).status).toBe(404);
    const res = await drummer.client.post(deliveryPaths.submit(deliveryId));
    expect(res.status).toBe(200);
    expect(res.body.delivery.submittedAt).not.toBeNull();
    expect(bookingStatus(app.db, bookingId)).toBe('delivered');
    const mail = await app.waitForMail(songwriter.email, /Stems delivered/);
    expect(mail.subject).toMatch(/v1/);
    expect((await drummer.client.post(deliveryPaths.submit(deliveryId))).status).toBe(409);
  });

  it('streams previews to the songwriter but keeps the originals locked before acceptance', async () => {
    const view = await songwriter.client.get(deliveryPaths.one(deliveryId));
    expect(view.body.delivery).toMatchObject({ originalsUnlocked: false, can: { accept: true, requestChanges: true, downloadOriginals: false } });
    const preview = await fetch(app.url + deliveryPaths.preview(deliveryId, fileIds['Snare Top.wav']), { headers: { cookie: cookieOf(songwriter.client) } });
    expect(preview.status).toBe(200);
    expect(preview.headers.get('x-content-type-options')).toBe('nosniff');
    expect((await songwriter.client.get(deliveryPaths.original(deliveryId, fileIds['Snare Top.wav']))).status).toBe(403);
    expect((await songwriter.client.get(deliveryPaths.zip(deliveryId))).status).toBe(403);
    expect((await outsider.client.get(deliveryPaths.preview(deliveryId, fileIds['Snare Top.wav']))).status).toBe(404);
    expect((await outsider.client.get(deliveryPaths.original(deliveryId, fileIds['Snare Top.wav']))).status).toBe(404);
    // The uploader and admins can always fetch the originals.
    const admins = await fetch(app.url + deliveryPaths.original(deliveryId, fileIds['Snare Top.wav']), { headers: { cookie: cookieOf(admin.client) } });
    expect(admins.status).toBe(200);
    expect(admins.headers.get('content-disposition')).toMatch(/^attachment; filename="Snare Top.wav"/);
    expect(sha256(Buffer.from(await admins.arrayBuffer()))).toBe(sha256(STEMS['Snare Top.wav']));
  });

  it('takes notes on the timeline from the songwriter only', async () => {
    const bad = await songwriter.client.post(deliveryPaths.notes(deliveryId), { atSec: -1, body: '' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['atSec', 'body']));
    expect((await drummer.client.post(deliveryPaths.notes(deliveryId), { atSec: 1, body: 'mine' })).status).toBe(403);
    expect((await outsider.client.post(deliveryPaths.notes(deliveryId), { atSec: 1, body: 'mine' })).status).toBe(404);
    const one = await songwriter.client.post(deliveryPaths.notes(deliveryId), { atSec: 1.25, fileId: fileIds['Snare Top.wav'], body: 'Snare a touch late here' });
    expect(one.status).toBe(201);
    const two = await songwriter.client.post(deliveryPaths.notes(deliveryId), { atSec: 0.5, body: 'Softer intro' });
    expect(two.status).toBe(201);
    const view = await songwriter.client.get(deliveryPaths.one(deliveryId));
    expect(view.body.delivery.notes.map((n: { atSec: number }) => n.atSec)).toEqual([0.5, 1.25]);
  });

  it('sends the notes as a list when the songwriter requests changes', async () => {
    expect((await drummer.client.post(deliveryPaths.requestChanges(deliveryId), {})).status).toBe(403);
    const res = await songwriter.client.post(deliveryPaths.requestChanges(deliveryId), { message: 'Close, two things:' });
    expect(res.status).toBe(200);
    expect(res.body.addOnsOutstanding).toBe(0);
    expect(res.body.delivery.decision).toBe('changes_requested');
    expect(bookingStatus(app.db, bookingId)).toBe('changes_requested');
    const mail = await app.waitForMail(drummer.email, /Changes asked for/);
    expect(mail.text).toContain('0:00.5: Softer intro');
    expect(mail.text).toContain('0:01.3 (Snare Top.wav): Snare a touch late here');
    expect((await songwriter.client.post(deliveryPaths.accept(deliveryId))).status).toBe(409);
  });

  it('accepts v2 and releases the money; the originals unlock, one by one and as a zip with a manifest', async () => {
    const v2 = await drummer.client.post(deliveryPaths.list(bookingId), { note: 'Fixed both.' });
    expect(v2.status).toBe(201);
    expect(v2.body.delivery.number).toBe(2);
    const id = v2.body.delivery.id as string;
    const ids: Record<string, string> = {};
    for (const [name, bytes] of Object.entries(STEMS)) ids[name] = await addAndUpload(drummer.client, id, name, bytes);
    await waitReady(drummer.client, id);
    expect((await drummer.client.post(deliveryPaths.submit(id))).status).toBe(200);
    expect((await outsider.client.post(deliveryPaths.accept(id))).status).toBe(404);
    expect((await drummer.client.post(deliveryPaths.accept(id))).status).toBe(403);
    // v1 was answered; only the newest version is reviewed.
    expect((await songwriter.client.post(deliveryPaths.accept(deliveryId))).status).toBe(409);
    const accepted = await songwriter.client.post(deliveryPaths.accept(id));
    expect(accepted.status).toBe(200);
    expect(accepted.body.delivery).toMatchObject({ decision: 'accepted', originalsUnlocked: true });
    expect(bookingStatus(app.db, bookingId)).toBe('accepted');

    const original = await fetch(app.url + deliveryPaths.original(id, ids['Kick In.wav']), { headers: { cookie: cookieOf(songwriter.client) } });
    expect(original.status).toBe(200);
    expect(sha256(Buffer.from(await original.arrayBuffer()))).toBe(sha256(STEMS['Kick In.wav']));

    const zip = await fetch(app.url + deliveryPaths.zip(id), { headers: { cookie: cookieOf(songwriter.client) } });
    expect(zip.status).toBe(200);
    expect(zip.headers.get('content-type')).toBe('application/zip');
    expect(zip.headers.get('content-disposition')).toMatch(/^attachment; filename="Copper-Tide-v2-stems.zip"/);
    const entries = readZip(Buffer.from(await zip.arrayBuffer()));
    expect(entries.map((e) => e.name)).toEqual(['manifest.json', ...Object.keys(STEMS)]);
    expect(entries.slice(1).every((e) => e.method === 0)).toBe(true);
    const manifest = JSON.parse(entries[0].data.toString('utf8'));
    for (const entry of entries.slice(1)) {
      const listed = manifest.files.find((f: { name: string }) => f.name === entry.name);
      expect(listed.sha256).toBe(sha256(entry.data));
      expect(listed.sha256).toBe(sha256(STEMS[entry.name as keyof typeof STEMS]));
      expect(listed).toMatchObject({ sizeBytes: entry.data.length, sampleRate: 48000, bitDepth: 24, format: expect.stringMatching(/^WAV PCM/) });
    }
    expect(manifest.check.summary).toMatch(/^3 stems/);
  }, 120_000);
});

describe('changes beyond the included revisions', () => {
  it('holds the next version until the extra revision is paid', async () => {
    const bookingId = await fundedBooking({ revisionsIncluded: 0 });
    const v1 = await drummer.client.post(deliveryPaths.list(bookingId), {});
    const id = v1.body.delivery.id as string;
    await addAndUpload(drummer.client, id, 'Kick In.wav', STEMS['Kick In.wav']);
    await waitReady(drummer.client, id);
    expect((await drummer.client.post(deliveryPaths.submit(id))).status).toBe(200);
    const asked = await songwriter.client.post(deliveryPaths.requestChanges(id), { message: 'Busier chorus, please.' });
    expect(asked.body.addOnsOutstanding).toBe(1);
    const blocked = await drummer.client.post(deliveryPaths.list(bookingId), {});
    expect(blocked.status).toBe(402);
    expect(blocked.body.error.code).toBe('add_on_unpaid');
    const list = await drummer.client.get(deliveryPaths.list(bookingId));
    expect(list.body).toMatchObject({ canCreate: false, createBlockedBy: expect.stringMatching(/extra revision/) });
  }, 90_000);
});

describe('gating and bad input', () => {
  it('refuses to submit before every file is uploaded and checked', async () => {
    const bookingId = await fundedBooking();
    const res = await drummer.client.post(deliveryPaths.list(bookingId), {});
    const id = res.body.delivery.id as string;
    expect((await drummer.client.post(deliveryPaths.submit(id))).body.error.message).toMatch(/Add the stems/);
    await drummer.client.post(deliveryPaths.files(id), { name: 'Kick In.wav', sizeBytes: STEMS['Kick In.wav'].length });
    const early = await drummer.client.post(deliveryPaths.submit(id));
    expect(early.status).toBe(409);
    expect(early.body.error.message).toMatch(/every file is uploaded/);
  });

  it('fails a text file named .wav in the report and blocks submission until it is removed', async () => {
    const bookingId = await fundedBooking();
    const id = (await drummer.client.post(deliveryPaths.list(bookingId), {})).body.delivery.id as string;
    const fake = await addAndUpload(drummer.client, id, 'Room L.wav', Buffer.from('these are not samples\n'.repeat(20)));
    await addAndUpload(drummer.client, id, 'Kick In.wav', STEMS['Kick In.wav']);
    const ready = await waitReady(drummer.client, id);
    expect(ready.check.report.unreadable).toEqual([expect.objectContaining({ name: 'Room L.wav' })]);
    expect(ready.files.find((f: { id: string }) => f.id === fake).previewStatus).toBe('failed');
    expect(ready.can.submit).toBe(false);
    expect(ready.submitBlockedBy).toMatch(/cannot be read/);
    expect((await drummer.client.delete(deliveryPaths.file(id, fake))).status).toBe(204);
    const again = await waitReady(drummer.client, id);
    expect(again.files).toHaveLength(1);
    expect(again.can.submit).toBe(true);
  }, 90_000);

  it('refuses deliveries on an unpaid booking, files over the size limit, duplicates and wrong users', async () => {
    const unpaid = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id });
    expect((await drummer.client.post(deliveryPaths.list(unpaid), {})).status).toBe(409);
    const bookingId = await fundedBooking();
    expect((await songwriter.client.post(deliveryPaths.list(bookingId), {})).status).toBe(403);
    expect((await outsider.client.post(deliveryPaths.list(bookingId), {})).status).toBe(404);
    expect((await drummer.client.post(deliveryPaths.list(bookingId), { note: 'x'.repeat(3000) })).status).toBe(400);
    const id = (await drummer.client.post(deliveryPaths.list(bookingId), {})).body.delivery.id as string;
    const huge = await drummer.client.post(deliveryPaths.files(id), { name: 'Huge.wav', sizeBytes: 5 * 1024 ** 3 });
    expect(huge.status).toBe(413);
    expect((await drummer.client.post(deliveryPaths.files(id), { name: 'Kick In.wav', sizeBytes: 100 })).status).toBe(201);
    expect((await drummer.client.post(deliveryPaths.files(id), { name: 'kick in.WAV', sizeBytes: 100 })).status).toBe(409);
    expect((await outsider.client.post(deliveryPaths.files(id), { name: 'Other.wav', sizeBytes: 100 })).status).toBe(404);
    const files = (await drummer.client.get(deliveryPaths.one(id))).body.delivery.files;
    expect((await drummer.client.patch(deliveryPaths.file(id, files[0].id), { part: 'not_a_part' })).status).toBe(400);
    const fixed = await drummer.client.patch(deliveryPaths.file(id, files[0].id), { part: 'kick_out' });
    expect(fixed.body.file.part).toBe('kick_out');
    expect((await outsider.client.patch(deliveryPaths.file(id, files[0].id), { part: 'kick_in' })).status).toBe(404);
    expect((await outsider.client.delete(deliveryPaths.file(id, files[0].id))).status).toBe(404);
    expect((await drummer.client.get(deliveryPaths.one('no-such-delivery'))).status).toBe(404);
    expect((await drummer.client.get(deliveryPaths.peaks(id, 'nope'))).status).toBe(404);
  });

  it('re-runs a check that a restart cut off', async () => {
    const bookingId = await fundedBooking();
    const id = (await drummer.client.post(deliveryPaths.list(bookingId), {})).body.delivery.id as string;
    await addAndUpload(drummer.client, id, 'Kick In.wav', STEMS['Kick In.wav']);
    await waitReady(drummer.client, id);
    const key = `delivery-check:${id}:2`;
    await waitUntil('the first check job to finish', () => app.db.select().from(jobs).where(eq(jobs.dedupeKey, key)).get()?.status === 'done');
    // As if the process died mid-check: the job is left running with a long lease and the delivery checking.
    app.db.update(jobs).set({ status: 'running', lockedBy: 'dead-process', lockedUntil: Date.now() + 3_600_000 }).where(eq(jobs.dedupeKey, key)).run();
    app.db.update(deliveries).set({ status: 'checking', checkStatus: 'running', checkProgress: 0.4 }).where(eq(deliveries.id, id)).run();
    app.db.$client.prepare('delete from delivery_checks where delivery_id = ?').run(id);
    const { registerDeliveryJobs } = await import('../../server/features/deliveries/delivery-jobs');
    const { createDeliveriesService } = await import('../../server/features/deliveries/deliveries.service');
    const { moneySeam } = await import('../../server/features/deliveries/money-seam');
    const { readDeliverySettings } = await import('../../server/features/deliveries/deliveries.config');
    const settings = readDeliverySettings();
    // Registering the jobs is what a fresh boot does.
    registerDeliveryJobs(app.kitlane.ctx, createDeliveriesService(app.kitlane.ctx, { settings, money: moneySeam(app.kitlane.ctx) }), settings);
    const ready = await waitReady(drummer.client, id);
    expect(ready.check.report.stems).toHaveLength(1);
    const job = await waitUntil('the re-run to finish', () => {
      const row = app.db.select().from(jobs).where(eq(jobs.dedupeKey, key)).get();
      return row?.status === 'done' ? row : null;
    });
    expect(job.attempts).toBe(2);
  }, 90_000);
});

/** A minimal reader for the zip's local file headers (enough to check names, methods and bytes). */
function readZip(buf: Buffer): { name: string; method: number; data: Buffer }[] {
  const out: { name: string; method: number; data: Buffer }[] = [];
  // Sizes live in the central directory when the writer streams (data descriptor); read them there.
  const eocd = buf.lastIndexOf(Buffer.from([0x50, 0x4b, 0x05, 0x06]));
  const count = buf.readUInt16LE(eocd + 10);
  let p = buf.readUInt32LE(eocd + 16);
  for (let i = 0; i < count; i++) {
    const method = buf.readUInt16LE(p + 10);
    const compressed = buf.readUInt32LE(p + 20);
    const nameLen = buf.readUInt16LE(p + 28);
    const extraLen = buf.readUInt16LE(p + 30);
    const commentLen = buf.readUInt16LE(p + 32);
    const local = buf.readUInt32LE(p + 42);
    const name = buf.toString('utf8', p + 46, p + 46 + nameLen);
    const localStart = local + 30 + buf.readUInt16LE(local + 26) + buf.readUInt16LE(local + 28);
    const raw = buf.subarray(localStart, localStart + compressed);
    out.push({ name, method, data: method === 8 ? inflateRawSync(raw) : Buffer.from(raw) });
    p += 46 + nameLen + extraLen + commentLen;
  }
  return out;
}
