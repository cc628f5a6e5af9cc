import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { signUp, startTestApp, type ApiClient, type TestApp } from './helpers/test-app';
import { synthReelWav } from '../../server/features/reels/reel-synth';
import { REEL_PEAK_POINTS } from '../../server/features/reels/reel-peaks';
import { REEL_MAX_BYTES, REEL_MAX_TRACKS } from '@shared/schemas/reels';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app?.close();
});

const profile = {
  headline: 'Reel tester',
  bio: '',
  styles: ['rock'],
  tags: [],
  kit: '',
  baseRateMinor: 10000,
  currency: 'EUR',
  turnaroundDays: 5,
  revisionsIncluded: 2,
  takingWork: true,
  town: '',
  country: '',
  timeZone: 'Europe/Berlin',
  published: true,
};

/** The cookie of an ApiClient session, for requests the JSON helper cannot make (multipart, raw ranges). */
function cookieOf(client: ApiClient): string {
  return (client as unknown as { cookie: string }).cookie;
}

async function upload(client: ApiClient, file: { bytes: Buffer; name: string; type: string }, fields: Record<string, string>) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append('file', new Blob([new Uint8Array(file.bytes)], { type: file.type }), file.name);
  const res = await fetch(`${app.url}/api/reel-tracks`, { method: 'POST', body: form, headers: { cookie: cookieOf(client) } });
  return { status: res.status, body: await res.json() };
}

async function raw(client: ApiClient | null, path: string, headers: Record<string, string> = {}) {
  const res = await fetch(app.url + path, { headers: { ...(client ? { cookie: cookieOf(client) } : {}), ...headers } });
  return { status: res.status, headers: res.headers, bytes: Buffer.from(await res.arrayBuffer()) };
}

function reelFiles(): string[] {
  const dir = join(app.dataDir, 'files', 'reels');
  return existsSync(dir) ? readdirSync(dir) : [];
}

/** A few MPEG-1 Layer III frame headers: enough for content sniffing, no audio we could decode. */
function fakeMp3(): Buffer {
  const frame = Buffer.alloc(417);
  Buffer.from([0xff, 0xfb, 0x90, 0x64]).copy(frame);
  return Buffer.concat([frame, frame, frame, frame]);
}

/** A real MP3 encoded by Debian's ffmpeg: a 440 Hz sine of the given length. */
function realMp3(seconds: number): Buffer {
  const dir = mkdtempSync(join(tmpdir(), 'kitlane-reel-mp3-'));
  try {
    const path = join(dir, 'take.mp3');
    execFileSync('ffmpeg', ['-hide_banner', '-loglevel', 'error', '-f', 'lavfi', '-i', `sine=frequency=440:duration=${seconds}:sample_rate=44100`, '-c:a', 'libmp3lame', '-b:a', '128k', path]);
    return readFileSync(path);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const wav = synthReelWav({ seconds: 8, tempo: 120, seed: 7 });

async function drummer(email: string, published = true) {
  const d = await signUp(app, { email, roles: ['drummer'] });
  await d.client.put('/api/profile/drummer', { ...profile, published });
  return d;
}

describe('uploading reel tracks', () => {
  it('takes a WAV, computes its peaks once, and lists it on the profile', async () => {
    const { client, user } = await drummer('r1@example.test');
    const res = await upload(client, { bytes: wav, name: 'groove.wav', type: 'audio/wav' }, { title: 'Groove one', style: 'rock', tempo: '120' });
    expect(res.status).toBe(201);
    expect(res.body.track).toMatchObject({ title: 'Groove one', style: 'rock', tempoBpm: 120, mime: 'audio/wav', sizeBytes: wav.length, hasPeaks: true, position: 0 });
    expect(res.body.track.durationSec).toBeCloseTo(8, 3);

    const peaks = await app.client().get(`/api/reel-tracks/${res.body.track.id}/peaks`);
    expect(peaks.status).toBe(200);
    expect(peaks.body.durationSec).toBeCloseTo(8, 3);
    expect(peaks.body.levels[0].data.length).toBe(Math.ceil((8 * 44100) / peaks.body.levels[0].samplesPerPixel));
    expect(Math.max(...peaks.body.levels[0].data)).toBeCloseTo(0.7, 2);

    const page = await app.client().get(`/api/drummers/${user.id}`);
    expect(page.body.drummer.reelTracks.map((t: { id: string }) => t.id)).toEqual([res.body.track.id]);
  });

  it('takes an MP3 by its content and draws its waveform with the same decoder as guide tracks', async () => {
    const { client } = await drummer('r2@example.test');
    const res = await upload(client, { bytes: realMp3(3), name: 'take.bin', type: 'application/octet-stream' }, { title: 'Mp3 take' });
    expect(res.status).toBe(201);
    expect(res.body.track).toMatchObject({ mime: 'audio/mpeg', hasPeaks: true, style: '', tempoBpm: null });
    // An MP3 encoder pads up to one frame (1152 samples ≈ 26 ms at 44.1 kHz).
    expect(res.body.track.durationSec).toBeGreaterThan(2.95);
    expect(res.body.track.durationSec).toBeLessThan(3.1);
    const peaks = await app.client().get(`/api/reel-tracks/${res.body.track.id}/peaks`);
    expect(peaks.status).toBe(200);
    expect(peaks.body.levels).toHaveLength(1);
    expect(peaks.body.levels[0].data.length).toBeLessThanOrEqual(REEL_PEAK_POINTS);
    // ffmpeg's sine source has amplitude 1/8 (0.125); MP3 coding moves it by a few per cent.
    expect(Math.max(...peaks.body.levels[0].data)).toBeCloseTo(0.125, 1);
  });

  it('keeps frame headers with no sound as a silent waveform rather than failing', async () => {
    const { client } = await drummer('r2b@example.test');
    const res = await upload(client, { bytes: fakeMp3(), name: 'take.mp3', type: 'audio/mpeg' }, { title: 'Empty frames' });
    expect(res.status).toBe(201);
    const peaks = await app.client().get(`/api/reel-tracks/${res.body.track.id}/peaks`);
    expect(Math.max(...peaks.body.levels[0].data)).toBe(0);
  });

  it('refuses a renamed text file with a clear message and stores nothing', async () => {
    const { client } = await drummer('r3@example.test');
    const before = reelFiles().length;
    const res = await upload(client, { bytes: Buffer.from('these are words, not audio\n'.repeat(50)), name: 'song.wav', type: 'audio/wav' }, { title: 'Fake' });
    expect(res.status).toBe(415);
    expect(res.body.error.message).toMatch(/checked by its content/);
    expect(reelFiles().length).toBe(before);
  });

  it('refuses a WAV that cannot be read (422) and stores nothing', async () => {
    const { client } = await drummer('r4@example.test');
    const before = reelFiles().length;
    const broken = Buffer.concat([Buffer.from('RIFF'), Buffer.from([0xff, 0, 0, 0]), Buffer.from('WAVE'), Buffer.from('fmt '), Buffer.from([2, 0, 0, 0, 1, 0])]);
    const res = await upload(client, { bytes: broken, name: 'broken.wav', type: 'audio/wav' }, { title: 'Broken' });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('unreadable_audio');
    expect(reelFiles().length).toBe(before);
  });

  it('answers 413 for a file over the size limit', async () => {
    const { client } = await drummer('r5@example.test');
    const big = Buffer.concat([wav.subarray(0, 44), Buffer.alloc(REEL_MAX_BYTES + 1024)]);
    const res = await upload(client, { bytes: big, name: 'huge.wav', type: 'audio/wav' }, { title: 'Huge' });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
  });

  it('answers 400 for bad fields and keeps no file', async () => {
    const { client } = await drummer('r6@example.test');
    const before = reelFiles().length;
    const res = await upload(client, { bytes: wav, name: 'x.wav', type: 'audio/wav' }, { title: '', tempo: '900', style: 'polka' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['style', 'tempo', 'title']);
    expect(reelFiles().length).toBe(before);
  });

  it('refuses uploads from a songwriter (403) and a visitor (401)', async () => {
    const { client } = await signUp(app, { email: 'rs1@example.test', roles: ['songwriter'] });
    expect((await upload(client, { bytes: wav, name: 'x.wav', type: 'audio/wav' }, { title: 'Nope' })).status).toBe(403);
    expect((await upload(app.client(), { bytes: wav, name: 'x.wav', type: 'audio/wav' }, { title: 'Nope' })).status).toBe(401);
  });

  it(`holds at most ${REEL_MAX_TRACKS} tracks`, async () => {
    const { client } = await drummer('r7@example.test');
    const small = synthReelWav({ seconds: 0.5, tempo: 120, seed: 2 });
    for (let i = 0; i < REEL_MAX_TRACKS; i++) {
      expect((await upload(client, { bytes: small, name: `t${i}.wav`, type: 'audio/wav' }, { title: `Track ${i}` })).status).toBe(201);
    }
    const full = await upload(client, { bytes: small, name: 'one-more.wav', type: 'audio/wav' }, { title: 'One more' });
    expect(full.status).toBe(409);
    expect(full.body.error.code).toBe('reel_full');
  });
});

describe('streaming reel audio with range requests', () => {
  let id = '';
  let owner: ApiClient;
  beforeAll(async () => {
    const d = await drummer('stream@example.test');
    owner = d.client;
    id = (await upload(owner, { bytes: wav, name: 'stream.wav', type: 'audio/wav' }, { title: 'Stream me' })).body.track.id;
  });

  it('sends the whole file with Accept-Ranges and nosniff', async () => {
    const res = await raw(null, `/api/reel-tracks/${id}/audio`);
    expect(res.status).toBe(200);
    expect(res.headers.get('accept-ranges')).toBe('bytes');
    expect(res.headers.get('content-type')).toBe('audio/wav');
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('content-length')).toBe(String(wav.length));
    expect(res.bytes.equals(wav)).toBe(true);
  });

  it('answers a byte range with 206 and exactly those bytes', async () => {
    const res = await raw(null, `/api/reel-tracks/${id}/audio`, { range: 'bytes=100-199' });
    expect(res.status).toBe(206);
    expect(res.headers.get('content-range')).toBe(`bytes 100-199/${wav.length}`);
    expect(res.bytes.equals(wav.subarray(100, 200))).toBe(true);
    const tail = await raw(null, `/api/reel-tracks/${id}/audio`, { range: 'bytes=-10' });
    expect(tail.status).toBe(206);
    expect(tail.bytes.equals(wav.subarray(wav.length - 10))).toBe(true);
    const open = await raw(null, `/api/reel-tracks/${id}/audio`, { range: `bytes=${wav.length - 5}-` });
    expect(open.bytes.equals(wav.subarray(wav.length - 5))).toBe(true);
  });

  it('answers 416 with the size for a range past the end or a reversed one', async () => {
    const past = await raw(null, `/api/reel-tracks/${id}/audio`, { range: `bytes=${wav.length}-` });
    expect(past.status).toBe(416);
    expect(past.headers.get('content-range')).toBe(`bytes */${wav.length}`);
    expect((await raw(null, `/api/reel-tracks/${id}/audio`, { range: 'bytes=500-20' })).status).toBe(416);
  });

  it('answers 404 for an unknown track', async () => {
    expect((await raw(null, '/api/reel-tracks/nope/audio')).status).toBe(404);
    expect((await raw(null, '/api/reel-tracks/nope/peaks')).status).toBe(404);
  });

  it('hides the tracks of an unpublished profile from others but not from the owner', async () => {
    await owner.put('/api/profile/drummer', { ...profile, published: false });
    expect((await raw(null, `/api/reel-tracks/${id}/audio`)).status).toBe(404);
    const stranger = (await signUp(app, { email: 'peek@example.test', roles: ['songwriter'] })).client;
    expect((await raw(stranger, `/api/reel-tracks/${id}/peaks`)).status).toBe(404);
    expect((await raw(owner, `/api/reel-tracks/${id}/audio`, { range: 'bytes=0-3' })).bytes.toString('latin1')).toBe('RIFF');
    await owner.put('/api/profile/drummer', profile);
  });
});

describe('deleting and reordering reel tracks', () => {
  it('reorders only with the full set of the drummer’s own tracks', async () => {
    const { client } = await drummer('order@example.test');
    const small = synthReelWav({ seconds: 0.5, tempo: 100, seed: 5 });
    const ids: string[] = [];
    for (const title of ['A', 'B', 'C']) ids.push((await upload(client, { bytes: small, name: 'a.wav', type: 'audio/wav' }, { title })).body.track.id);
    const other = await drummer('order2@example.test');
    const theirs = (await upload(other.client, { bytes: small, name: 'b.wav', type: 'audio/wav' }, { title: 'Theirs' })).body.track.id;

    expect((await client.put('/api/reel-tracks/order', { ids: [ids[0], ids[1]] })).status).toBe(400);
    expect((await client.put('/api/reel-tracks/order', { ids: [ids[0], ids[1], theirs] })).status).toBe(400);
    expect((await client.put('/api/reel-tracks/order', { ids: [ids[0], ids[0], ids[1]] })).status).toBe(400);
    expect((await other.client.put('/api/reel-tracks/order', { ids })).status).toBe(400);

    const res = await client.put('/api/reel-tracks/order', { ids: [ids[2], ids[0], ids[1]] });
    expect(res.status).toBe(200);
    expect(res.body.tracks.map((t: { title: string }) => t.title)).toEqual(['C', 'A', 'B']);
    const own = await client.get('/api/profile/drummer');
    expect(own.body.reelTracks.map((t: { title: string }) => t.title)).toEqual(['C', 'A', 'B']);
  });

  it('deletes a track and its files for the owner; others get 404', async () => {
    const { client } = await drummer('del@example.test');
    const track = (await upload(client, { bytes: wav, name: 'd.wav', type: 'audio/wav' }, { title: 'Delete me' })).body.track;
    const files = reelFiles().filter((f) => f.startsWith(track.id));
    expect(files.sort()).toEqual([`${track.id}.peaks.json`, `${track.id}.wav`]);

    const stranger = await drummer('del2@example.test');
    expect((await stranger.client.delete(`/api/reel-tracks/${track.id}`)).status).toBe(404);
    expect((await app.client().delete(`/api/reel-tracks/${track.id}`)).status).toBe(401);

    expect((await client.delete(`/api/reel-tracks/${track.id}`)).status).toBe(204);
    expect((await raw(null, `/api/reel-tracks/${track.id}/audio`)).status).toBe(404);
    expect(reelFiles().filter((f) => f.startsWith(track.id))).toEqual([]);
  });
});
