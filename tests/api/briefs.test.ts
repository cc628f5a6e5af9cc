import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { execFileSync, spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { todayIn } from '@shared/schemas/briefs';
import { DEMO_PASSWORD, signUp, startTestApp, type ApiClient, type TestApp } from './helpers/test-app';
import { briefBody, daysFromToday, demoGuide, fetchWithSession, publishedBrief, quoteBody, uploadFile } from './helpers/hire';

let app: TestApp;
let songwriter: ApiClient;
let otherSongwriter: ApiClient;
let drummer: ApiClient;
let drummerId: string;
let secondDrummer: ApiClient;
let secondDrummerId: string;

beforeAll(async () => {
  app = await startTestApp();
  songwriter = (await signUp(app, { email: 'sw@example.test', roles: ['songwriter'], displayName: 'Nell Songwriter' })).client;
  otherSongwriter = (await signUp(app, { email: 'sw2@example.test', roles: ['songwriter'] })).client;
  const d = await signUp(app, { email: 'dr@example.test', roles: ['drummer'], displayName: 'Odo Drummer' });
  drummer = d.client;
  drummerId = d.user.id;
  const d2 = await signUp(app, { email: 'dr2@example.test', roles: ['drummer'] });
  secondDrummer = d2.client;
  secondDrummerId = d2.user.id;
});
afterAll(async () => {
  await app?.close();
});

describe('writing a brief', () => {
  it('creates a draft with every field of the brief and the songwriter as owner', async () => {
    const res = await songwriter.post('/api/briefs', briefBody({ stemMode: 'named', stemList: ['Kick', 'Snare', 'Overheads'] }));
    expect(res.status).toBe(201);
    expect(res.body.brief).toMatchObject({
      status: 'draft',
      songTitle: 'Harbour Lights',
      tempoBpm: 120,
      lengthBars: 96,
      songCount: 2,
      sampleRate: 48000,
      bitDepth: '24',
      stemMode: 'named',
      stemList: ['Kick', 'Snare', 'Overheads'],
      roughMix: true,
      budgetMinMinor: 20000,
      budgetMaxMinor: 60000,
      currency: 'USD',
      timeZone: 'UTC',
      guide: null,
      viewer: { isOwner: true, quoteCount: 0 },
    });
  });

  it('answers 400 with a message beside each wrong field', async () => {
    const res = await songwriter.post(
      '/api/briefs',
      briefBody({ tempoBpm: 301, sampleRate: 22050, bitDepth: '16', budgetMinMinor: 70000, lengthBars: null, currency: 'XYZ', deadline: '2030-02-30' }),
    );
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['bitDepth', 'currency', 'deadline', 'sampleRate', 'tempoBpm']);
    const cross = await songwriter.post('/api/briefs', briefBody({ budgetMinMinor: 70000, lengthBars: null, stemMode: 'named' }));
    expect(cross.status).toBe(400);
    expect(Object.keys(cross.body.error.fields).sort()).toEqual(['budgetMaxMinor', 'lengthBars', 'stemList']);
  });

  it('accepts tempo at 20 and 300 BPM and refuses 19.9', async () => {
    expect((await songwriter.post('/api/briefs', briefBody({ tempoBpm: 20 }))).status).toBe(201);
    expect((await songwriter.post('/api/briefs', briefBody({ tempoBpm: 300 }))).status).toBe(201);
    expect((await songwriter.post('/api/briefs', briefBody({ tempoBpm: 19.9 }))).status).toBe(400);
  });

  it('takes the length as minutes:seconds instead of bars', async () => {
    const res = await songwriter.post('/api/briefs', briefBody({ lengthBars: null, lengthSeconds: 225 }));
    expect(res.status).toBe(201);
    expect(res.body.brief).toMatchObject({ lengthBars: null, lengthSeconds: 225 });
  });

  it('judges the deadline in the songwriter’s own time zone: today there is fine, the day before is refused', async () => {
    for (const zone of ['Pacific/Kiritimati', 'Pacific/Pago_Pago']) {
      const me = await songwriter.get('/api/me');
      const set = await songwriter.patch('/api/account', { displayName: me.body.user.displayName, roles: ['songwriter'], timeZone: zone });
      expect(set.status).toBe(200);
      const today = todayIn(zone);
      const ok = await songwriter.post('/api/briefs', briefBody({ deadline: today }));
      expect(ok.status).toBe(201);
      expect(ok.body.brief.timeZone).toBe(zone);
      const past = await songwriter.post('/api/briefs', briefBody({ deadline: daysFromToday(-1, zone) }));
      expect(past.status).toBe(400);
      expect(past.body.error.fields.deadline).toMatch(/passed/);
    }
    const me = await songwriter.get('/api/me');
    await songwriter.patch('/api/account', { displayName: me.body.user.displayName, roles: ['songwriter'], timeZone: 'UTC' });
  });

  it('refuses briefs from people who are not songwriters (403) and from signed-out visitors (401)', async () => {
    expect((await drummer.post('/api/briefs', briefBody())).status).toBe(403);
    expect((await app.client().post('/api/briefs', briefBody())).status).toBe(401);
  });

  it('never answers 500 to junk bodies', async () => {
    for (const body of ['[]', '"x"', '{"songTitle":{"a":1}}', '{"tempoBpm":"fast"}']) {
      const res = await songwriter.request('POST', '/api/briefs', body);
      expect(res.status).toBe(400);
    }
  });
});

describe('draft, publish, edit, withdraw', () => {
  it('hides a draft from everyone but its owner with 404', async () => {
    const id = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
    expect((await songwriter.get(`/api/briefs/${id}`)).status).toBe(200);
    for (const other of [drummer, otherSongwriter]) {
      const res = await other.get(`/api/briefs/${id}`);
      expect(res.status).toBe(404);
      expect(JSON.stringify(res.body)).not.toContain('Harbour');
      expect((await other.patch(`/api/briefs/${id}`, briefBody())).status).toBe(404);
      expect((await other.post(`/api/briefs/${id}/publish`)).status).toBe(404);
    }
    const open = await drummer.get('/api/briefs/open');
    expect(open.body.items.map((b: { id: string }) => b.id)).not.toContain(id);
  });

  it('edits a draft, then refuses edits once it is published (409)', async () => {
    const id = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
    const edited = await songwriter.patch(`/api/briefs/${id}`, briefBody({ songTitle: 'Harbour Lights (slow)', tempoBpm: 84 }));
    expect(edited.status).toBe(200);
    expect(edited.body.brief).toMatchObject({ songTitle: 'Harbour Lights (slow)', tempoBpm: 84, status: 'draft' });
    const published = await songwriter.post(`/api/briefs/${id}/publish`);
    expect(published.status).toBe(200);
    expect(published.body.brief.status).toBe('open');
    expect(published.body.brief.publishedAt).toBeTruthy();
    const again = await songwriter.patch(`/api/briefs/${id}`, briefBody());
    expect(again.status).toBe(409);
    expect((await songwriter.post(`/api/briefs/${id}/publish`)).status).toBe(409);
  });

  it('lets another songwriter see an open brief only if they are a drummer: otherwise 404, and 403 on the owner’s actions', async () => {
    const id = await publishedBrief(songwriter);
    expect((await otherSongwriter.get(`/api/briefs/${id}`)).status).toBe(404);
    const seen = await drummer.get(`/api/briefs/${id}`);
    expect(seen.status).toBe(200);
    expect(seen.body.brief.viewer).toMatchObject({ isOwner: false, quoteCount: null });
    expect(seen.body.brief.invitedDrummers).toBeUndefined();
    expect((await drummer.post(`/api/briefs/${id}/withdraw`)).status).toBe(403);
    expect((await drummer.post(`/api/briefs/${id}/invites`, { drummerIds: [secondDrummerId] })).status).toBe(403);
  });

  it('withdraws an open brief: it leaves the open list, takes no quotes (409), and waiting quotes are declined', async () => {
    const id = await publishedBrief(songwriter, { songTitle: 'Withdrawn Song' });
    const q = await drummer.post(`/api/briefs/${id}/quotes`, quoteBody());
    expect(q.status).toBe(201);
    const res = await songwriter.post(`/api/briefs/${id}/withdraw`);
    expect(res.status).toBe(200);
    expect(res.body.brief.status).toBe('withdrawn');
    const open = await drummer.get('/api/briefs/open');
    expect(open.body.items.map((b: { id: string }) => b.id)).not.toContain(id);
    expect((await secondDrummer.post(`/api/briefs/${id}/quotes`, quoteBody())).status).toBe(404);
    const mine = await drummer.get(`/api/quotes/${q.body.quote.id}`);
    expect(mine.body.quote).toMatchObject({ status: 'declined', declineReason: 'The songwriter withdrew the brief' });
    // The drummer who quoted still sees the withdrawn brief; the twice-withdrawn answer is 409.
    expect((await drummer.get(`/api/briefs/${id}`)).body.brief.status).toBe('withdrawn');
    expect((await songwriter.post(`/api/briefs/${id}/withdraw`)).status).toBe(409);
  });

  it('withdraws a draft too', async () => {
    const id = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
    expect((await songwriter.post(`/api/briefs/${id}/withdraw`)).body.brief.status).toBe('withdrawn');
  });

  it('lists the songwriter’s own briefs of every status with their quote counts', async () => {
    const res = await songwriter.get('/api/briefs/mine');
    expect(res.status).toBe(200);
    const statuses = new Set(res.body.items.map((b: { status: string }) => b.status));
    expect(statuses).toEqual(new Set(['draft', 'open', 'withdrawn']));
    expect(res.body.total).toBe(res.body.items.length);
    expect((await otherSongwriter.get('/api/briefs/mine')).body.items).toEqual([]);
  });
});

describe('open briefs for drummers', () => {
  let fast: string;
  let slow: string;
  let rich: string;
  beforeAll(async () => {
    const s = (await signUp(app, { email: 'filters@example.test', roles: ['songwriter'] })).client;
    fast = await publishedBrief(s, { style: 'punk', tempoBpm: 190, budgetMaxMinor: 30000, budgetMinMinor: 10000, deadline: daysFromToday(10) });
    slow = await publishedBrief(s, { style: 'punk', tempoBpm: 70, budgetMaxMinor: 40000, budgetMinMinor: 10000, deadline: daysFromToday(40) });
    rich = await publishedBrief(s, { style: 'soul', tempoBpm: 96, budgetMaxMinor: 250000, budgetMinMinor: 100000, deadline: daysFromToday(20) });
  });
  const ids = (res: { body: { items: { id: string }[] } }) => res.body.items.map((b) => b.id);

  it('filters by style, budget, deadline and tempo', async () => {
    const punk = await drummer.get('/api/briefs/open?style=punk');
    expect(new Set(ids(punk))).toEqual(new Set([fast, slow]));
    expect(ids(await drummer.get('/api/briefs/open?budgetMin=200000'))).toEqual([rich]);
    const soon = ids(await drummer.get(`/api/briefs/open?style=punk&deadlineBefore=${daysFromToday(15)}`));
    expect(soon).toEqual([fast]);
    expect(ids(await drummer.get('/api/briefs/open?style=punk&tempoMin=100&tempoMax=200'))).toEqual([fast]);
    expect(ids(await drummer.get('/api/briefs/open?style=punk&tempoMax=80'))).toEqual([slow]);
  });

  it('compares the budget filter only with briefs priced in the same currency', async () => {
    const s = (await signUp(app, { email: 'yen-filter@example.test', roles: ['songwriter'] })).client;
    const yen = await publishedBrief(s, { style: 'funk', currency: 'JPY', budgetMinMinor: 30000, budgetMaxMinor: 60000 });
    const inUsd = ids(await drummer.get('/api/briefs/open?budgetMin=200000&currency=USD'));
    expect(inUsd).toEqual([rich]);
    const inYen = ids(await drummer.get('/api/briefs/open?budgetMin=50000&currency=jpy'));
    expect(inYen).toEqual([yen]);
  });

  it('answers 400, not 500, to bad filters', async () => {
    for (const q of ['page=0', 'style=polka', 'budgetMin=abc', 'currency=XYZ', 'deadlineBefore=tomorrow', 'tempoMin=x', 'unknown=1']) {
      expect((await drummer.get(`/api/briefs/open?${q}`)).status).toBe(400);
    }
  });

  it('is for drummers only', async () => {
    expect((await otherSongwriter.get('/api/briefs/open')).status).toBe(403);
    expect((await app.client().get('/api/briefs/open')).status).toBe(401);
  });

  it('pages by 20', async () => {
    const page1 = await drummer.get('/api/briefs/open');
    expect(page1.body).toMatchObject({ page: 1, pageSize: 20 });
    expect(page1.body.total).toBeGreaterThanOrEqual(page1.body.items.length);
    const far = await drummer.get('/api/briefs/open?page=99');
    expect(far.body.items).toEqual([]);
    expect(far.body.total).toBe(page1.body.total);
  });
});

describe('invitations', () => {
  it('puts an invited brief first in the drummer’s list, notifies them and mails them', async () => {
    const s = (await signUp(app, { email: 'inviter@example.test', roles: ['songwriter'], displayName: 'Ivy Inviter' })).client;
    const older = await publishedBrief(s, { songTitle: 'Invite Me Song' });
    await publishedBrief(s, { songTitle: 'Newer Song' });
    const before = await secondDrummer.get('/api/briefs/open');
    expect(before.body.items[0].id).not.toBe(older);

    const res = await s.post(`/api/briefs/${older}/invites`, { drummerIds: [secondDrummerId, secondDrummerId] });
    expect(res.status).toBe(200);
    expect(res.body.invited).toEqual([secondDrummerId]);
    expect(res.body.brief.invitedDrummers.map((d: { id: string }) => d.id)).toEqual([secondDrummerId]);

    const after = await secondDrummer.get('/api/briefs/open');
    expect(after.body.items[0]).toMatchObject({ id: older, invited: true });
    // Other drummers keep the plain newest-first order.
    const other = await drummer.get('/api/briefs/open');
    expect(other.body.items.find((b: { id: string }) => b.id === older).invited).toBe(false);

    const mail = await app.waitForMail('dr2@example.test', /invited you to quote on “Invite Me Song”/);
    expect(mail.links.some((l) => l.endsWith(`/briefs/${older}`))).toBe(true);
    // Inviting again sends nothing new.
    const again = await s.post(`/api/briefs/${older}/invites`, { drummerIds: [secondDrummerId] });
    expect(again.body.invited).toEqual([]);
  });

  it('refuses to invite people who are not drummers, and invites on a draft (409)', async () => {
    const s = (await signUp(app, { email: 'inviter2@example.test', roles: ['songwriter'] })).client;
    const me = await otherSongwriter.get('/api/me');
    const id = await publishedBrief(s);
    const res = await s.post(`/api/briefs/${id}/invites`, { drummerIds: [me.body.user.id] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.drummerIds).toBeTruthy();
    const draft = (await s.post('/api/briefs', briefBody())).body.brief.id;
    expect((await s.post(`/api/briefs/${draft}/invites`, { drummerIds: [drummerId] })).status).toBe(409);
  });
});

describe('guide track', () => {
  it('stores a WAV guide with waveform peaks computed on the server and streams it with range requests', async () => {
    const id = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
    const wav = demoGuide(4);
    const up = await uploadFile(songwriter, app.url, `/api/briefs/${id}/guide`, { bytes: wav, name: 'demo mix.wav', type: 'audio/wav' });
    expect(up.status).toBe(200);
    expect(up.body.brief.guide).toMatchObject({ name: 'demo mix.wav', mime: 'audio/wav', hasPeaks: true });
    expect(up.body.brief.guide.durationSec).toBeCloseTo(4, 3);

    const peaks = await fetchWithSession(songwriter, `${app.url}/api/briefs/${id}/guide/peaks`);
    expect(peaks.status).toBe(200);
    const json = await peaks.json();
    expect(json.durationSec).toBeCloseTo(4, 3);
    expect(json.sampleRate).toBe(22050);
    expect(json.levels[0].data.length).toBe(Math.ceil((4 * 22050) / json.levels[0].samplesPerPixel));
    expect(Math.max(...json.levels[0].data)).toBeGreaterThan(0.3);

    const whole = await fetchWithSession(songwriter, `${app.url}/api/briefs/${id}/guide`);
    expect(whole.status).toBe(200);
    expect(whole.headers.get('accept-ranges')).toBe('bytes');
    expect(Buffer.from(await whole.arrayBuffer()).equals(wav)).toBe(true);

    const part = await fetchWithSession(songwriter, `${app.url}/api/briefs/${id}/guide`, { range: 'bytes=100-199' });
    expect(part.status).toBe(206);
    expect(part.headers.get('content-range')).toBe(`bytes 100-199/${wav.length}`);
    expect(Buffer.from(await part.arrayBuffer()).equals(wav.subarray(100, 200))).toBe(true);

    const tail = await fetchWithSession(songwriter, `${app.url}/api/briefs/${id}/guide`, { range: 'bytes=-10' });
    expect(Buffer.from(await tail.arrayBuffer()).equals(wav.subarray(wav.length - 10))).toBe(true);

    const beyond = await fetchWithSession(songwriter, `${app.url}/api/briefs/${id}/guide`, { range: `bytes=${wav.length}-` });
    expect(beyond.status).toBe(416);
    expect(beyond.headers.get('content-range')).toBe(`bytes */${wav.length}`);
  });

  it('streams the guide to drummers once the brief is open, never to others or while it is a draft', async () => {
    const id = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
    await uploadFile(songwriter, app.url, `/api/briefs/${id}/guide`, { bytes: demoGuide(2), name: 'g.wav', type: 'audio/wav' });
    expect((await fetchWithSession(drummer, `${app.url}/api/briefs/${id}/guide`)).status).toBe(404);
    await songwriter.post(`/api/briefs/${id}/publish`);
    expect((await fetchWithSession(drummer, `${app.url}/api/briefs/${id}/guide`)).status).toBe(200);
    expect((await fetchWithSession(drummer, `${app.url}/api/briefs/${id}/guide/peaks`)).status).toBe(200);
    expect((await fetchWithSession(otherSongwriter, `${app.url}/api/briefs/${id}/guide`)).status).toBe(404);
    expect((await fetch(`${app.url}/api/briefs/${id}/guide`)).status).toBe(401);
    // Published: the guide can no longer change.
    const late = await uploadFile(songwriter, app.url, `/api/briefs/${id}/guide`, { bytes: demoGuide(2), name: 'g.wav', type: 'audio/wav' });
    expect(late.status).toBe(409);
  });

  it('accepts an MP3 guide by its content and draws its peaks too', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'kitlane-mp3-'));
    try {
      const mp3 = join(dir, 'g.mp3');
      execFileSync('ffmpeg', ['-hide_banner', '-loglevel', 'error', '-f', 'lavfi', '-i', 'sine=frequency=220:duration=3:sample_rate=44100', '-c:a', 'libmp3lame', '-b:a', '128k', mp3]);
      const id = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
      // Named .bin and sent as octet-stream: only the content says it is an MP3.
      const up = await uploadFile(songwriter, app.url, `/api/briefs/${id}/guide`, { bytes: readFileSync(mp3), name: 'guide.bin', type: 'application/octet-stream' });
      expect(up.status).toBe(200);
      expect(up.body.brief.guide).toMatchObject({ mime: 'audio/mpeg', hasPeaks: true });
      expect(up.body.brief.guide.durationSec).toBeGreaterThan(2.9);
      expect(up.body.brief.guide.durationSec).toBeLessThan(3.2);
      const peaks = await (await fetchWithSession(songwriter, `${app.url}/api/briefs/${id}/guide/peaks`)).json();
      // Checked against an independent decoder: ffmpeg's astats reads the same file's sample peak.
      const stats = spawnSync('ffmpeg', ['-hide_banner', '-i', mp3, '-af', 'astats', '-f', 'null', '-'], { encoding: 'utf8' }).stderr;
      const lines = [...stats.matchAll(/Peak level dB: (-?[\d.]+)/g)];
      expect(lines.length).toBeGreaterThan(0);
      const ffmpegPeakDb = Number(lines[lines.length - 1][1]);
      const ourPeakDb = 20 * Math.log10(Math.max(...peaks.levels[0].data));
      expect(Math.abs(ourPeakDb - ffmpegPeakDb)).toBeLessThan(0.2);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('refuses a text file renamed .wav with a clear message, and stores nothing', async () => {
    const id = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
    const res = await uploadFile(songwriter, app.url, `/api/briefs/${id}/guide`, { bytes: Buffer.from('just some words, not audio\n'.repeat(50)), name: 'song.wav', type: 'audio/wav' });
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/not a WAV or MP3 file/);
    expect(existsSync(join(app.dataDir, 'files', 'guides', id))).toBe(false);
  });

  it('refuses a broken WAV (RIFF header, no audio) with 422 and leaves no file', async () => {
    const id = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
    const broken = Buffer.concat([demoGuide(1).subarray(0, 40), Buffer.alloc(3)]);
    const res = await uploadFile(songwriter, app.url, `/api/briefs/${id}/guide`, { bytes: broken, name: 'b.wav', type: 'audio/wav' });
    expect(res.status).toBe(422);
    expect(existsSync(join(app.dataDir, 'files', 'guides', id))).toBe(false);
  });

  it('answers 413 for a guide over the size limit and leaves no partial file', async () => {
    const id = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
    const big = Buffer.concat([demoGuide(1), Buffer.alloc(61 * 1024 * 1024)]);
    const res = await uploadFile(songwriter, app.url, `/api/briefs/${id}/guide`, { bytes: big, name: 'big.wav', type: 'audio/wav' });
    expect(res.status).toBe(413);
    expect(existsSync(join(app.dataDir, 'files', 'guides', id))).toBe(false);
  });

  it('refuses uploads to somebody else’s brief before reading the file (404)', async () => {
    const id = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
    const res = await uploadFile(otherSongwriter, app.url, `/api/briefs/${id}/guide`, { bytes: demoGuide(1), name: 'g.wav', type: 'audio/wav' });
    expect(res.status).toBe(404);
  });

  it('replaces the old guide files when a new guide is uploaded', async () => {
    const id = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
    await uploadFile(songwriter, app.url, `/api/briefs/${id}/guide`, { bytes: demoGuide(1), name: 'a.wav', type: 'audio/wav' });
    await uploadFile(songwriter, app.url, `/api/briefs/${id}/guide`, { bytes: demoGuide(2), name: 'b.wav', type: 'audio/wav' });
    const files = readdirSync(join(app.dataDir, 'files', 'guides', id));
    expect(files).toHaveLength(2);
    expect(files.some((f) => f.endsWith('.wav'))).toBe(true);
    expect(files.some((f) => f.endsWith('.peaks.json'))).toBe(true);
  });
});

describe('the demo seed', () => {
  let seeded: TestApp;
  beforeAll(async () => {
    seeded = await startTestApp({ seed: true });
  });
  afterAll(async () => {
    await seeded?.close();
  });

  async function signIn(email: string) {
    const c = seeded.client();
    const res = await c.post('/api/auth/login', { email, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    return c;
  }

  it('has open briefs from the songwriters with synthesised guide tracks, quotes, and one booking awaiting payment', async () => {
    const juno = await signIn('juno@kitlane.test');
    const open = await juno.get('/api/briefs/open');
    expect(open.body.items.length).toBeGreaterThanOrEqual(2);
    // Juno was invited to Paper Lanterns, so it comes first.
    expect(open.body.items[0]).toMatchObject({ songTitle: 'Paper Lanterns', invited: true, hasGuide: true });
    const peaks = await fetchWithSession(juno, `${seeded.url}/api/briefs/${open.body.items[0].id}/guide/peaks`);
    const json = await peaks.json();
    expect(json.durationSec).toBeGreaterThanOrEqual(10);
    expect(json.durationSec).toBeLessThanOrEqual(20);

    const teo = await signIn('teo@kitlane.test');
    const teosBookings = (await teo.get('/api/bookings')).body.items as { terms: { songTitle: string } }[];
    // The payments step funds this one; the money issue owns what happens after awaiting payment.
    expect(teosBookings.find((b) => b.terms.songTitle === 'Low Tide Motel')).toMatchObject({ currency: 'USD', totalMinor: 26000, drummer: { displayName: 'Odell Brisk' } });
    const mara = await signIn('mara@kitlane.test');
    const marasBookings = (await mara.get('/api/bookings')).body.items as { terms: { songTitle: string } }[];
    expect(marasBookings.find((b) => b.terms.songTitle === 'Chalk Hill')).toMatchObject({ status: 'awaiting_payment', currency: 'GBP', totalMinor: 16000, drummer: { displayName: 'Kofi Arlen' }, terms: { songTitle: 'Chalk Hill' } });
    const mine = (await mara.get('/api/briefs/mine')).body.items as { songTitle: string }[];
    expect(mine.find((b) => b.songTitle === 'Paper Lanterns')).toMatchObject({ status: 'open', quoteCount: 2 });
    expect(mine.find((b) => b.songTitle === 'Chalk Hill')).toMatchObject({ status: 'hired', quoteCount: 1 });
  });
});
