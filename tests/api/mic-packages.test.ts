import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { bookings } from '../../server/db/schema';
import { signUp, startTestApp, type ApiClient, type TestApp } from './helpers/test-app';
import { publishedBrief, quoteBody } from './helpers/hire';
import { packageBody, roomBody } from './helpers/room-bodies';

let app: TestApp;
let engineer: ApiClient;
let engineerId: string;
let otherEngineer: ApiClient;
let songwriter: ApiClient;
let otherSongwriter: ApiClient;
let drummer: ApiClient;
let otherDrummer: ApiClient;
let anonymous: ApiClient;
let roomId: string;

beforeAll(async () => {
  app = await startTestApp();
  const e = await signUp(app, { email: 'eng@example.test', roles: ['engineer'], displayName: 'Ida Engineer' });
  engineer = e.client;
  engineerId = e.user.id;
  otherEngineer = (await signUp(app, { email: 'eng2@example.test', roles: ['engineer'] })).client;
  songwriter = (await signUp(app, { email: 'sw@example.test', roles: ['songwriter'] })).client;
  otherSongwriter = (await signUp(app, { email: 'sw2@example.test', roles: ['songwriter'] })).client;
  drummer = (await signUp(app, { email: 'dr@example.test', roles: ['drummer'], displayName: 'Odo Drummer' })).client;
  otherDrummer = (await signUp(app, { email: 'dr2@example.test', roles: ['drummer'] })).client;
  anonymous = app.client();
  roomId = (await engineer.post('/api/rooms', roomBody({ inputs: 16 }))).body.room.id;
});
afterAll(async () => {
  await app?.close();
});

async function createPackage(body: Record<string, unknown> = packageBody(), room = roomId): Promise<string> {
  const res = await engineer.post(`/api/rooms/${room}/packages`, body);
  if (res.status !== 201) throw new Error(`package create failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.package.id as string;
}

describe('making a mic package', () => {
  it('creates a 12-channel package from a template, with its pairs for the delivery check', async () => {
    const res = await engineer.post(`/api/rooms/${roomId}/packages`, packageBody('twelve_channel'));
    expect(res.status).toBe(201);
    const pkg = res.body.package;
    expect(pkg).toMatchObject({ roomId, engineerId, name: 'Full kit', priceMinor: 12_000, currency: 'USD', roomInputs: 16, mine: true, archived: false });
    expect(pkg.channels.map((c: { source: string }) => c.source)).toEqual([
      'kick_in', 'kick_out', 'snare_top', 'snare_bottom', 'hi_hat', 'rack_tom_1', 'rack_tom_2', 'floor_tom_1', 'overhead_l', 'overhead_r', 'room_l', 'room_r',
    ]);
    // The template flips the snare bottom at the preamp, so the recorded stems should match the top.
    expect(pkg.pairs).toContainEqual(expect.objectContaining({ kind: 'top_bottom', aSource: 'snare_top', bSource: 'snare_bottom', expectInverted: false }));
    expect(pkg.pairs).toContainEqual(expect.objectContaining({ kind: 'overhead_pair', aSource: 'overhead_l', bSource: 'overhead_r', expectInverted: false }));
    expect((await anonymous.get(`/api/rooms/${roomId}/packages`)).body.items.map((p: { id: string }) => p.id)).toContain(pkg.id);
  });

  it('refuses more channels than the room has inputs, as a field error', async () => {
    const small = (await engineer.post('/api/rooms', roomBody({ inputs: 8 }))).body.room.id;
    const res = await engineer.post(`/api/rooms/${small}/packages`, packageBody('twelve_channel'));
    expect(res.status).toBe(400);
    expect(res.body.error.fields.channels).toBe('This package has 12 channels but the room has 8 inputs');
    expect(res.body.error.fields['channels.8.number']).toBe('The room has inputs 1–8; there is no input 9');
  });

  it('answers bad channels with a field error per channel', async () => {
    const body = packageBody('four_channel');
    const channels = body.channels as unknown as Record<string, unknown>[];
    channels[1] = { ...channels[1], distanceCm: -3 };
    channels[2] = { ...channels[2], pattern: 'shotgun' };
    const res = await engineer.post(`/api/rooms/${roomId}/packages`, { ...body, priceMinor: -1 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['channels.1.distanceCm', 'channels.2.pattern', 'priceMinor']);
    const twice = packageBody('four_channel');
    (twice.channels as unknown as Record<string, unknown>[])[3].number = 1;
    const duplicate = await engineer.post(`/api/rooms/${roomId}/packages`, twice);
    expect(duplicate.body.error.fields).toEqual({ 'channels.3.number': 'Channel 1 is used twice' });
  });

  it('lets only the room’s engineer add packages to it', async () => {
    expect((await otherEngineer.post(`/api/rooms/${roomId}/packages`, packageBody())).status).toBe(403);
    expect((await songwriter.post(`/api/rooms/${roomId}/packages`, packageBody())).status).toBe(403);
    expect((await anonymous.post(`/api/rooms/${roomId}/packages`, packageBody())).status).toBe(401);
    expect((await engineer.post('/api/rooms/no-such-room/packages', packageBody())).status).toBe(404);
  });
});

describe('changing a mic package', () => {
  it('saves a new channel order and checks it against the room again', async () => {
    const id = await createPackage(packageBody('eight_channel'));
    const pkg = (await anonymous.get(`/api/mic-packages/${id}`)).body.package;
    const reordered = [pkg.channels[1], pkg.channels[0], ...pkg.channels.slice(2)];
    const res = await engineer.patch(`/api/mic-packages/${id}`, { channels: reordered });
    expect(res.status).toBe(200);
    expect(res.body.package.channels.slice(0, 2).map((c: { source: string }) => c.source)).toEqual(['snare_top', 'kick_in']);
    const tooHigh = await engineer.patch(`/api/mic-packages/${id}`, { channels: [{ ...pkg.channels[0], number: 17 }] });
    expect(tooHigh.status).toBe(400);
    expect(tooHigh.body.error.fields).toEqual({ 'channels.0.number': 'The room has inputs 1–16; there is no input 17' });
  });

  it('keeps the room from dropping below the inputs a package uses', async () => {
    const room = (await engineer.post('/api/rooms', roomBody({ inputs: 12 }))).body.room.id;
    await createPackage(packageBody('twelve_channel', { name: 'Twelve' }), room);
    const res = await engineer.patch(`/api/rooms/${room}`, { inputs: 8 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.inputs).toMatch(/“Twelve” uses 12 channels/);
    expect((await engineer.patch(`/api/rooms/${room}`, { inputs: 24 })).status).toBe(200);
  });

  it('refuses another engineer, a songwriter and a stranger', async () => {
    const id = await createPackage();
    expect((await otherEngineer.patch(`/api/mic-packages/${id}`, { name: 'Mine' })).status).toBe(403);
    expect((await songwriter.patch(`/api/mic-packages/${id}`, { name: 'Mine' })).status).toBe(403);
    expect((await anonymous.patch(`/api/mic-packages/${id}`, { name: 'Mine' })).status).toBe(401);
    expect((await otherEngineer.delete(`/api/mic-packages/${id}`)).status).toBe(403);
    expect((await engineer.get(`/api/mic-packages/${id}`)).body.package.name).toBe('Full kit');
  });

  it('removes a package from the room’s offers but keeps it readable', async () => {
    const id = await createPackage(packageBody('four_channel', { name: 'Going away' }));
    expect((await engineer.delete(`/api/mic-packages/${id}`)).status).toBe(204);
    expect((await anonymous.get(`/api/rooms/${roomId}/packages`)).body.items.map((p: { id: string }) => p.id)).not.toContain(id);
    expect((await anonymous.get(`/api/mic-packages/${id}`)).body.package.archived).toBe(true);
    expect((await engineer.patch(`/api/mic-packages/${id}`, { name: 'Back' })).status).toBe(409);
  });

  it('lists the engineer’s own packages only to them', async () => {
    const mine = await engineer.get('/api/mic-packages/mine');
    expect(mine.body.total).toBeGreaterThan(0);
    expect((await otherEngineer.get('/api/mic-packages/mine')).body.total).toBe(0);
    expect((await anonymous.get('/api/mic-packages/mine')).status).toBe(401);
  });
});

describe('a quote that names a package', () => {
  let packageId: string;
  let quoteId: string;
  let bookingId: string;

  beforeAll(async () => {
    packageId = await createPackage(packageBody('twelve_channel', { name: 'Rock kit, 12 in', priceMinor: 9_000 }));
    const briefId = await publishedBrief(songwriter, { songCount: 1 });
    const quote = await drummer.post(`/api/briefs/${briefId}/quotes`, quoteBody({ packageId, rushFeeMinor: 0 }));
    if (quote.status !== 201) throw new Error(`quote failed: ${quote.status} ${JSON.stringify(quote.body)}`);
    quoteId = quote.body.quote.id;
  });

  it('makes the package price the engineer’s share and waits for the engineer', async () => {
    const quote = (await songwriter.get(`/api/quotes/${quoteId}`)).body.quote;
    expect(quote.packageId).toBe(packageId);
    expect(quote.engineer).toMatchObject({ id: engineerId, shareMinor: 9_000, status: 'pending' });
    expect(quote.lineItems).toContainEqual(expect.objectContaining({ kind: 'package', label: 'Room and mic package: Rock kit, 12 in', unitAmount: 9_000 }));
  });

  it('lets the songwriter see the room and the package it names', async () => {
    const pkg = (await songwriter.get(`/api/mic-packages/${packageId}`)).body.package;
    expect(pkg).toMatchObject({ roomId, roomName: 'Block room', name: 'Rock kit, 12 in' });
    expect((await songwriter.get(`/api/rooms/${pkg.roomId}/acoustics`)).status).toBe(200);
  });

  it('refuses to remove a package while a waiting quote names it', async () => {
    const res = await engineer.delete(`/api/mic-packages/${packageId}`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('package_on_waiting_quote');
    expect((await engineer.delete(`/api/rooms/${roomId}`)).status).toBe(409);
  });

  it('refuses a removed package or one priced in another currency', async () => {
    const gone = await createPackage(packageBody('four_channel', { name: 'Gone' }));
    await engineer.delete(`/api/mic-packages/${gone}`);
    const eur = await createPackage(packageBody('four_channel', { name: 'Euro', currency: 'EUR' }));
    const briefId = await publishedBrief(otherSongwriter);
    const removed = await otherDrummer.post(`/api/briefs/${briefId}/quotes`, quoteBody({ packageId: gone }));
    expect(removed.status).toBe(400);
    expect(removed.body.error.fields).toEqual({ packageId: 'That mic package was not found' });
    const wrongCurrency = await otherDrummer.post(`/api/briefs/${briefId}/quotes`, quoteBody({ packageId: eur }));
    expect(wrongCurrency.body.error.fields).toEqual({ packageId: 'That package is priced in EUR; the brief pays in USD' });
  });

  it('copies the input list with its pairs into the booking on acceptance', async () => {
    expect((await engineer.post(`/api/quotes/${quoteId}/engineer-response`, { confirm: true })).status).toBe(200);
    const accepted = await songwriter.post(`/api/quotes/${quoteId}/accept`);
    expect(accepted.status).toBe(201);
    bookingId = accepted.body.booking.id;
    expect(accepted.body.booking.terms.packageName).toBe('Rock kit, 12 in');
    // Edited after the copy: the booking keeps what was agreed.
    await engineer.patch(`/api/mic-packages/${packageId}`, { name: 'Renamed later' });
    const row = app.db.select().from(bookings).where(eq(bookings.id, bookingId)).get()!;
    const list = row.inputList as { packageName: string; roomId: string; channels: unknown[]; checkPairs: { a: string; b: string; expectInverted?: boolean }[] };
    expect(list.packageName).toBe('Rock kit, 12 in');
    expect(list.roomId).toBe(roomId);
    expect(list.channels).toHaveLength(12);
    expect(list.checkPairs).toContainEqual({ a: 'snare_top', b: 'snare_bottom', expectInverted: false });
    expect(list.checkPairs).toContainEqual({ a: 'kick_in', b: 'kick_out', expectInverted: false });
    expect(list.checkPairs).toContainEqual({ a: 'kick_in', b: 'overhead_l' });
  });

  describe('the session prep checklist', () => {
    it('starts with every item open, each marked common practice', async () => {
      const res = await songwriter.get(`/api/bookings/${bookingId}/prep`);
      expect(res.status).toBe(200);
      expect(res.body.prep).toMatchObject({ room: { id: roomId, name: 'Block room' }, doneCount: 0, canTick: false, history: [] });
      expect(res.body.prep.items.map((i: { id: string }) => i.id)).toEqual([
        'kit_set_before_mics', 'no_squeaks', 'stands_decoupled', 'cables_routed_labelled', 'tall_stands_weighted', 'hearing_protection', 'drummer_asked_about_mics',
      ]);
      expect(res.body.prep.items.every((i: { basis: string }) => i.basis === 'common practice')).toBe(true);
    });

    it('records who ticked what and when, and unticks as a new record', async () => {
      const ticked = await drummer.put(`/api/bookings/${bookingId}/prep/kit_set_before_mics`, { done: true });
      expect(ticked.status).toBe(200);
      await engineer.put(`/api/bookings/${bookingId}/prep/stands_decoupled`, { done: true });
      await engineer.put(`/api/bookings/${bookingId}/prep/stands_decoupled`, { done: true });
      const unticked = await engineer.put(`/api/bookings/${bookingId}/prep/stands_decoupled`, { done: false });
      const prep = unticked.body.prep;
      expect(prep.doneCount).toBe(1);
      expect(prep.canTick).toBe(true);
      expect(prep.history.map((h: { itemId: string; done: boolean; by: { displayName: string } }) => [h.itemId, h.done, h.by.displayName])).toEqual([
        ['kit_set_before_mics', true, 'Odo Drummer'],
        ['stands_decoupled', true, 'Ida Engineer'],
        ['stands_decoupled', false, 'Ida Engineer'],
      ]);
      const kit = prep.items.find((i: { id: string }) => i.id === 'kit_set_before_mics');
      expect(kit.done).toBe(true);
      expect(Date.parse(kit.last.at)).toBeGreaterThan(Date.now() - 60_000);
    });

    it('lets only the drummer and engineer tick, and hides the list from strangers', async () => {
      expect((await songwriter.put(`/api/bookings/${bookingId}/prep/no_squeaks`, { done: true })).status).toBe(403);
      expect((await otherDrummer.put(`/api/bookings/${bookingId}/prep/no_squeaks`, { done: true })).status).toBe(404);
      expect((await otherDrummer.get(`/api/bookings/${bookingId}/prep`)).status).toBe(404);
      expect((await anonymous.get(`/api/bookings/${bookingId}/prep`)).status).toBe(401);
    });

    it('answers an unknown item or a missing answer with a field error', async () => {
      const unknown = await drummer.put(`/api/bookings/${bookingId}/prep/polish_cymbals`, { done: true });
      expect(unknown.status).toBe(400);
      expect(unknown.body.error.fields).toEqual({ itemId: 'There is no such checklist item' });
      const noAnswer = await drummer.put(`/api/bookings/${bookingId}/prep/no_squeaks`, {});
      expect(noAnswer.body.error.fields).toEqual({ done: 'Say whether the item is done' });
    });

    it('closes once the booking has ended', async () => {
      app.db.update(bookings).set({ status: 'cancelled' }).where(eq(bookings.id, bookingId)).run();
      const res = await drummer.put(`/api/bookings/${bookingId}/prep/no_squeaks`, { done: true });
      expect(res.status).toBe(409);
      expect((await drummer.get(`/api/bookings/${bookingId}/prep`)).body.prep.canTick).toBe(false);
    });
  });
});
