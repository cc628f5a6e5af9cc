import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { signUp, startTestApp, type ApiClient, type TestApp } from './helpers/test-app';
import { fetchWithSession, uploadFile } from './helpers/hire';
import { roomBody, uniformRoomBody } from './helpers/room-bodies';

let app: TestApp;
let engineer: ApiClient;
let engineerId: string;
let otherEngineer: ApiClient;
let songwriter: ApiClient;
let anonymous: ApiClient;

beforeAll(async () => {
  app = await startTestApp();
  const e = await signUp(app, { email: 'eng@example.test', roles: ['engineer'], displayName: 'Ida Engineer' });
  engineer = e.client;
  engineerId = e.user.id;
  otherEngineer = (await signUp(app, { email: 'eng2@example.test', roles: ['engineer'] })).client;
  songwriter = (await signUp(app, { email: 'sw@example.test', roles: ['songwriter'] })).client;
  anonymous = app.client();
});
afterAll(async () => {
  await app?.close();
});

async function createRoom(body: Record<string, unknown> = roomBody(), who: ApiClient = engineer): Promise<string> {
  const res = await who.post('/api/rooms', body);
  if (res.status !== 201) throw new Error(`room create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.room.id as string;
}

describe('listing a room', () => {
  it('creates a room with its geometry and the computed figures search uses', async () => {
    const res = await engineer.post('/api/rooms', roomBody());
    expect(res.status).toBe(201);
    expect(res.body.room).toMatchObject({
      engineerId,
      engineerName: 'Ida Engineer',
      name: 'Block room',
      town: 'Testing Town',
      timeZone: 'Europe/Berlin',
      dayRateMinor: 40_000,
      halfDayRateMinor: 22_000,
      currency: 'USD',
      inputs: 16,
      dimensions: { unit: 'm', length: 6, width: 5, height: 3 },
      photos: [],
      blockedDates: [],
      mine: true,
      archived: false,
      packageCount: 0,
    });
    expect(res.body.room.volumeM3).toBeCloseTo(90, 9);
    expect(res.body.room.floorAreaM2).toBeCloseTo(30, 9);
  });

  it('keeps feet as typed and converts them for the acoustics', async () => {
    const id = await createRoom(roomBody({ dimensions: { unit: 'ft', length: 20, width: 16, height: 10 } }));
    const room = (await anonymous.get(`/api/rooms/${id}`)).body.room;
    expect(room.dimensions).toEqual({ unit: 'ft', length: 20, width: 16, height: 10 });
    // 20 × 16 × 10 ft = 3200 ft³ = 90.6 m³ (1 ft = 0.3048 m exactly).
    expect(room.volumeM3).toBeCloseTo(3200 * 0.3048 ** 3, 9);
  });

  it('answers bad input with a field error beside each wrong field, never a 500', async () => {
    const res = await engineer.post(
      '/api/rooms',
      roomBody({
        dimensions: { unit: 'm', length: -6, width: 500, height: 3 },
        inputs: 0,
        dayRateMinor: -5,
        halfDayRateMinor: -5,
        timeZone: 'Nowhere/Nothing',
      }),
    );
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['dayRateMinor', 'dimensions.length', 'dimensions.width', 'halfDayRateMinor', 'inputs', 'timeZone']);
    expect(res.body.error.fields['dimensions.length']).toBe('Length must be between 1.5 and 60 m');
  });

  it('refuses absorption coefficients outside 0–1 with the band that is wrong', async () => {
    const body = roomBody();
    (body.surfaces as Record<string, unknown>).ceiling = { kind: 'custom', coefficients: [0.1, 1.4, 0.2, 0.2, -0.2, 0.3] };
    const res = await engineer.post('/api/rooms', body);
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      'surfaces.ceiling.coefficients.1': 'Absorption coefficients are between 0 and 1',
      'surfaces.ceiling.coefficients.4': 'Absorption coefficients are between 0 and 1',
    });
  });

  it('refuses panels larger than the wall they hang on', async () => {
    const res = await engineer.post('/api/rooms', roomBody({ panels: [{ surface: 'frontWall', areaM2: 16, finish: { kind: 'material', materialId: 'glass_fibre_board_50mm' } }] }));
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['panels.0.areaM2']);
  });

  it('answers malformed JSON with 400', async () => {
    const res = await engineer.request('POST', '/api/rooms', '{"name":', { 'content-type': 'application/json' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
  });

  it('lets only engineers list rooms, and only signed in', async () => {
    expect((await songwriter.post('/api/rooms', roomBody())).status).toBe(403);
    expect((await anonymous.post('/api/rooms', roomBody())).status).toBe(401);
  });
});

describe('changing a room', () => {
  it('merges a partial update and recomputes the acoustics columns', async () => {
    const id = await createRoom();
    const before = (await anonymous.get(`/api/rooms/${id}`)).body.room;
    const res = await engineer.patch(`/api/rooms/${id}`, {
      name: 'Block room, treated',
      panels: [{ surface: 'leftWall', areaM2: 6, finish: { kind: 'material', materialId: 'glass_fibre_board_50mm' } }],
    });
    expect(res.status).toBe(200);
    expect(res.body.room).toMatchObject({ name: 'Block room, treated', town: 'Testing Town', inputs: 16 });
    expect(res.body.room.midRt60Sec).toBeLessThan(before.midRt60Sec);
  });

  it('checks the merged room as a whole (half-day rate above the stored day rate)', async () => {
    const id = await createRoom();
    const res = await engineer.patch(`/api/rooms/${id}`, { halfDayRateMinor: 50_000 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ halfDayRateMinor: 'The half-day rate cannot be more than the day rate' });
  });

  it('refuses another engineer, a songwriter and a stranger', async () => {
    const id = await createRoom();
    expect((await otherEngineer.patch(`/api/rooms/${id}`, { name: 'Mine now' })).status).toBe(403);
    expect((await songwriter.patch(`/api/rooms/${id}`, { name: 'Mine now' })).status).toBe(403);
    expect((await anonymous.patch(`/api/rooms/${id}`, { name: 'Mine now' })).status).toBe(401);
    expect((await otherEngineer.delete(`/api/rooms/${id}`)).status).toBe(403);
    expect((await otherEngineer.put(`/api/rooms/${id}/blocked-dates`, { dates: [] })).status).toBe(403);
    expect((await anonymous.get(`/api/rooms/${id}`)).body.room.name).toBe('Block room');
  });

  it('answers 404 for a room that does not exist', async () => {
    expect((await anonymous.get('/api/rooms/no-such-room')).status).toBe(404);
    expect((await anonymous.get('/api/rooms/no-such-room/acoustics')).status).toBe(404);
    expect((await engineer.patch('/api/rooms/no-such-room', { name: 'x' })).status).toBe(404);
  });

  it('removes a room from search but keeps it readable, and refuses changes afterwards', async () => {
    const id = await createRoom(roomBody({ town: 'Removal Town' }));
    expect((await anonymous.get('/api/rooms?town=Removal%20Town')).body.total).toBe(1);
    expect((await engineer.delete(`/api/rooms/${id}`)).status).toBe(204);
    expect((await anonymous.get('/api/rooms?town=Removal%20Town')).body.total).toBe(0);
    expect((await anonymous.get(`/api/rooms/${id}`)).body.room.archived).toBe(true);
    expect((await engineer.patch(`/api/rooms/${id}`, { name: 'Back' })).status).toBe(409);
  });

  it('lists the engineer’s own rooms', async () => {
    const mine = await engineer.get('/api/rooms/mine');
    expect(mine.status).toBe(200);
    expect(mine.body.items.length).toBeGreaterThan(0);
    expect(mine.body.items.every((r: { engineerId: string }) => r.engineerId === engineerId)).toBe(true);
    expect((await otherEngineer.get('/api/rooms/mine')).body.total).toBe(0);
    expect((await anonymous.get('/api/rooms/mine')).status).toBe(401);
  });
});

describe('the calendar of blocked dates', () => {
  it('replaces the future blocked dates, sorted and without duplicates', async () => {
    const id = await createRoom();
    const res = await engineer.put(`/api/rooms/${id}/blocked-dates`, { dates: ['2099-03-02', '2099-03-01', '2099-03-02'] });
    expect(res.status).toBe(200);
    expect(res.body.blockedDates).toEqual(['2099-03-01', '2099-03-02']);
    await engineer.put(`/api/rooms/${id}/blocked-dates`, { dates: ['2099-04-10'] });
    expect((await songwriter.get(`/api/rooms/${id}`)).body.room.blockedDates).toEqual(['2099-04-10']);
  });

  it('refuses a date that does not exist', async () => {
    const id = await createRoom();
    const res = await engineer.put(`/api/rooms/${id}/blocked-dates`, { dates: ['2099-02-30'] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ 'dates.0': 'That date does not exist' });
  });
});

describe('GET /api/rooms/:id/acoustics', () => {
  it('returns the fixed shape: six bands, axial modes, the Schroeder frequency and a reading', async () => {
    const id = await createRoom();
    const res = await songwriter.get(`/api/rooms/${id}/acoustics`);
    expect(res.status).toBe(200);
    expect(res.body.bands.map((b: { hz: number }) => b.hz)).toEqual([125, 250, 500, 1000, 2000, 4000]);
    for (const band of res.body.bands) {
      expect(Object.keys(band)).toEqual(expect.arrayContaining(['hz', 'sabineSec', 'eyringSec']));
      expect(band.sabineSec).toBeGreaterThan(band.eyringSec);
    }
    expect(res.body.modes[0]).toMatchObject({ axis: 'length', order: 1 });
    expect(Object.keys(res.body.modes[0])).toEqual(expect.arrayContaining(['hz', 'axis', 'order']));
    expect(typeof res.body.schroederHz).toBe('number');
    expect(['tight', 'controlled', 'lively', 'very_live']).toContain(res.body.reading);
  });

  it('matches Sabine and Eyring worked by hand for a room with one coefficient everywhere (REFERENCES.md formulas)', async () => {
    // 6 × 5 × 3 m: V = 90 m³, S = 126 m²; α = 0.1 → A = 12.6 m².
    const id = await createRoom(uniformRoomBody(0.1));
    const res = await anonymous.get(`/api/rooms/${id}/acoustics`);
    const sabine = (0.161 * 90) / 12.6;
    const eyring = (0.161 * 90) / (-126 * Math.log(1 - 0.1));
    for (const band of res.body.bands) {
      expect(band.sabineSec).toBeCloseTo(sabine, 9);
      expect(band.eyringSec).toBeCloseTo(eyring, 9);
    }
    // Fairly reflective (ᾱ ≤ 0.2): Sabine is the figure; 1.15 s reads very live.
    expect(res.body.recommended).toBe('sabine');
    expect(res.body.midBandRt60Sec).toBeCloseTo(sabine, 9);
    expect(res.body.reading).toBe('very_live');
    expect(res.body.schroederHz).toBeCloseTo(2000 * Math.sqrt(sabine / 90), 9);
  });

  it('prefers Eyring in a well-damped room and reads it as controlled', async () => {
    const id = await createRoom(uniformRoomBody(0.3));
    const res = await anonymous.get(`/api/rooms/${id}/acoustics`);
    const eyring = (0.161 * 90) / (-126 * Math.log(1 - 0.3));
    expect(res.body.recommended).toBe('eyring');
    expect(res.body.midBandRt60Sec).toBeCloseTo(eyring, 9);
    expect(res.body.reading).toBe('controlled');
  });

  it('lists the axial modes of each dimension, n·c/2L at c = 331.3 + 0.606·20 m/s, with coincidences flagged', async () => {
    const id = await createRoom();
    const res = await anonymous.get(`/api/rooms/${id}/acoustics`);
    const c = 331.3 + 0.606 * 20;
    const width = res.body.modes.filter((m: { axis: string }) => m.axis === 'width');
    expect(width.slice(0, 2).map((m: { hz: number }) => m.hz)).toEqual([c / 10, (2 * c) / 10]);
    // Length 2 (57.2 Hz) and height 1 (57.2 Hz) coincide in a 6 × 5 × 3 m room.
    const height1 = res.body.modes.find((m: { axis: string; order: number }) => m.axis === 'height' && m.order === 1);
    expect(height1.coincidentWith).toEqual([expect.objectContaining({ axis: 'length', order: 2 })]);
  });
});

describe('searching rooms', () => {
  let smallDead: string;
  let bigLive: string;
  let farAway: string;

  beforeAll(async () => {
    smallDead = await createRoom(uniformRoomBody(0.5, { name: 'Vocal booth', town: 'Searchville', dimensions: { unit: 'm', length: 4, width: 3, height: 2.5 }, inputs: 8, dayRateMinor: 15_000, halfDayRateMinor: 9_000 }));
    bigLive = await createRoom(uniformRoomBody(0.08, { name: 'Stone hall', town: 'Searchville', dimensions: { unit: 'm', length: 12, width: 9, height: 6 }, inputs: 48, dayRateMinor: 90_000, halfDayRateMinor: 50_000, description: 'A big stone hall with a long ring.' }));
    farAway = await createRoom(roomBody({ name: 'Barn', town: 'Searchville', timeZone: 'America/Chicago', inputs: 24, currency: 'EUR', dayRateMinor: 30_000, halfDayRateMinor: 16_000 }));
  });

  const ids = (body: { items: { id: string }[] }) => body.items.map((r) => r.id).sort();

  it('filters by town, time zone band, size, reverberation, day rate and inputs', async () => {
    expect(ids((await anonymous.get('/api/rooms?town=Searchville')).body)).toEqual([smallDead, bigLive, farAway].sort());
    expect(ids((await anonymous.get('/api/rooms?town=Searchville&tzBand=americas')).body)).toEqual([farAway]);
    expect(ids((await anonymous.get('/api/rooms?town=Searchville&minVolume=200')).body)).toEqual([bigLive]);
    expect(ids((await anonymous.get('/api/rooms?town=Searchville&rtMax=0.4')).body)).toEqual([smallDead]);
    expect(ids((await anonymous.get('/api/rooms?town=Searchville&rtMin=2.5')).body)).toEqual([bigLive]);
    expect(ids((await anonymous.get('/api/rooms?town=Searchville&maxDayRate=200&currency=USD')).body)).toEqual([smallDead]);
    expect(ids((await anonymous.get('/api/rooms?town=Searchville&minInputs=24')).body)).toEqual([bigLive, farAway].sort());
  });

  it('finds words in the name, town or description', async () => {
    expect(ids((await anonymous.get('/api/rooms?q=stone%20ring')).body)).toEqual([bigLive]);
    expect(ids((await anonymous.get('/api/rooms?q=100%25')).body)).toEqual([]);
  });

  it('pages with a total and returns the card fields', async () => {
    const page1 = await anonymous.get('/api/rooms?town=Searchville&pageSize=2&page=1');
    const page2 = await anonymous.get('/api/rooms?town=Searchville&pageSize=2&page=2');
    expect(page1.body.total).toBe(3);
    expect(page1.body.items).toHaveLength(2);
    expect(page2.body.items).toHaveLength(1);
    expect(page1.body.items[0]).toMatchObject({ town: 'Searchville', thumbUrl: null, archived: false });
    expect(page1.body.items[0]).toHaveProperty('midRt60Sec');
  });

  it('answers a bad filter with a field error', async () => {
    const res = await anonymous.get('/api/rooms?rtMin=0.9&rtMax=0.2&minInputs=lots');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('minInputs');
    const noCurrency = await anonymous.get('/api/rooms?maxDayRate=100');
    expect(noCurrency.body.error.fields).toEqual({ currency: 'Pick the currency of the highest day rate' });
  });
});

describe('room photos', () => {
  async function png(width: number, height: number): Promise<Buffer> {
    return sharp({ create: { width, height, channels: 3, background: { r: 90, g: 110, b: 140 } } }).png().toBuffer();
  }

  it('stores a re-encoded photo and a thumbnail made on the server', async () => {
    const id = await createRoom();
    const res = await uploadFile(engineer, app.url, `/api/rooms/${id}/photos`, { bytes: await png(2400, 1200), name: 'room.png', type: 'image/png' });
    expect(res.status).toBe(201);
    expect(res.body.photo).toMatchObject({ width: 1600, height: 800 });
    const thumb = await fetch(app.url + res.body.photo.thumbUrl);
    expect(thumb.status).toBe(200);
    expect(thumb.headers.get('content-type')).toBe('image/webp');
    const meta = await sharp(Buffer.from(await thumb.arrayBuffer())).metadata();
    expect([meta.width, meta.height]).toEqual([400, 200]);
    const room = (await anonymous.get(`/api/rooms/${id}`)).body.room;
    expect(room.photos).toHaveLength(1);
    expect(room.thumbUrl).toBe(res.body.photo.thumbUrl);
  });

  it('decides the type by content: a text file named .jpg is refused', async () => {
    const id = await createRoom();
    const res = await uploadFile(engineer, app.url, `/api/rooms/${id}/photos`, { bytes: Buffer.from('not a picture at all'), name: 'room.jpg', type: 'image/jpeg' });
    expect(res.status).toBe(415);
    expect(res.body.error.fields).toEqual({ file: 'Only JPG or PNG or WEBP files are accepted' });
  });

  it('refuses a photo over the size limit with 413', async () => {
    const id = await createRoom();
    const big = Buffer.concat([await png(8, 8), Buffer.alloc(10 * 1024 * 1024 + 1)]);
    const res = await uploadFile(engineer, app.url, `/api/rooms/${id}/photos`, { bytes: big, name: 'big.png', type: 'image/png' });
    expect(res.status).toBe(413);
  });

  it('lets only the room’s engineer add or delete photos', async () => {
    const id = await createRoom();
    const bytes = await png(64, 64);
    expect((await uploadFile(otherEngineer, app.url, `/api/rooms/${id}/photos`, { bytes, name: 'x.png', type: 'image/png' })).status).toBe(403);
    const added = await uploadFile(engineer, app.url, `/api/rooms/${id}/photos`, { bytes, name: 'x.png', type: 'image/png' });
    expect((await otherEngineer.delete(`/api/rooms/${id}/photos/${added.body.photo.id}`)).status).toBe(403);
    expect((await engineer.delete(`/api/rooms/${id}/photos/${added.body.photo.id}`)).status).toBe(204);
    expect((await fetchWithSession(engineer, app.url + added.body.photo.url)).status).toBe(404);
  });
});

describe('the demo seed', () => {
  it('lists rooms of different sizes and treatments for the demo engineers, each with a package', async () => {
    const seeded = await startTestApp({ seed: true });
    try {
      const res = await seeded.client().get('/api/rooms?pageSize=50');
      const items = res.body.items as { engineerName: string; volumeM3: number; reading: string; packageCount: number }[];
      expect(new Set(items.map((r) => r.engineerName))).toEqual(new Set(['Hollis Grane', 'Bea Lindqvist', 'Rune Halloway', 'Wren Solberg']));
      expect(new Set(items.map((r) => r.reading)).size).toBeGreaterThanOrEqual(3);
      const volumes = items.map((r) => r.volumeM3);
      expect(Math.max(...volumes) / Math.min(...volumes)).toBeGreaterThan(10);
      expect(items.every((r) => r.packageCount > 0)).toBe(true);
    } finally {
      await seeded.close();
    }
  });
});
