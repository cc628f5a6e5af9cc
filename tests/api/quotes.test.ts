import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { bookings, briefs, quotes, users } from '../../server/db/schema';
import { transitionBooking } from '../../server/features/bookings/bookings.service';
import { inTransaction } from '../../server/features/briefs/in-transaction';
import { signUp, startTestApp, type ApiClient, type TestApp } from './helpers/test-app';
import { briefBody, publishedBrief, quoteBody } from './helpers/hire';

let app: TestApp;
let songwriter: ApiClient;
let stranger: ApiClient;
let drummers: { client: ApiClient; id: string; email: string }[];
let engineer: { client: ApiClient; id: string };
let admin: ApiClient;

beforeAll(async () => {
  app = await startTestApp();
  songwriter = (await signUp(app, { email: 'sw@example.test', roles: ['songwriter'], displayName: 'Sally Writer' })).client;
  stranger = (await signUp(app, { email: 'stranger@example.test', roles: ['songwriter', 'engineer'] })).client;
  drummers = [];
  for (const n of [1, 2, 3]) {
    const email = `d${n}@example.test`;
    const d = await signUp(app, { email, roles: ['drummer'], displayName: `Drummer ${n}` });
    drummers.push({ client: d.client, id: d.user.id, email });
  }
  const e = await signUp(app, { email: 'eng@example.test', roles: ['engineer'], displayName: 'Enid Engineer' });
  engineer = { client: e.client, id: e.user.id };
  const a = await signUp(app, { email: 'boss@example.test', roles: ['songwriter'] });
  app.db.update(users).set({ roles: ['admin'] }).where(eq(users.id, a.user.id)).run();
  admin = a.client;
});
afterAll(async () => {
  await app?.close();
});

describe('sending a quote', () => {
  it('computes line items and the total on the server: per-song fee × songs plus rush; the extra-revision price is beside it', async () => {
    const briefId = await publishedBrief(songwriter, { songCount: 3, currency: 'EUR' });
    const res = await drummers[0].client.post(`/api/briefs/${briefId}/quotes`, quoteBody({ perSongFeeMinor: 12345, rushFeeMinor: 1000, extraRevisionMinor: 3000 }));
    expect(res.status).toBe(201);
    const q = res.body.quote;
    expect(q.lineItems).toEqual([
      { kind: 'per_song', label: 'Drum tracks, per song × 3', unitAmount: 12345, quantity: 3 },
      { kind: 'rush', label: 'Rush fee', unitAmount: 1000, quantity: 1 },
    ]);
    expect(q).toMatchObject({ totalMinor: 12345 * 3 + 1000, currency: 'EUR', extraRevisionMinor: 3000, status: 'sent', drummerShareMinor: 12345 * 3 + 1000, engineer: null, blockedReason: null });
    const validFor = Date.parse(q.validUntil) - Date.now();
    expect(validFor).toBeGreaterThan(13.9 * 86_400_000);
    expect(validFor).toBeLessThanOrEqual(14 * 86_400_000);
    const mail = await app.waitForMail('sw@example.test', /New quote from Drummer 1/);
    expect(mail.links.some((l) => l.endsWith(`/briefs/${briefId}/quotes`))).toBe(true);
  });

  it('ignores any total or line items the client tries to send (400: unknown fields)', async () => {
    const briefId = await publishedBrief(songwriter);
    const res = await drummers[0].client.post(`/api/briefs/${briefId}/quotes`, { ...quoteBody(), totalMinor: 1 });
    expect(res.status).toBe(400);
  });

  it('lets a drummer quote only once per brief (409)', async () => {
    const briefId = await publishedBrief(songwriter);
    expect((await drummers[1].client.post(`/api/briefs/${briefId}/quotes`, quoteBody())).status).toBe(201);
    const twice = await drummers[1].client.post(`/api/briefs/${briefId}/quotes`, quoteBody());
    expect(twice.status).toBe(409);
    expect(twice.body.error.code).toBe('quote_exists');
  });

  it('refuses a quote on your own brief (403)', async () => {
    const both = (await signUp(app, { email: 'both@example.test', roles: ['songwriter', 'drummer'] })).client;
    const briefId = await publishedBrief(both);
    const res = await both.post(`/api/briefs/${briefId}/quotes`, quoteBody());
    expect(res.status).toBe(403);
    // And their own brief is not in their open list.
    const open = await both.get('/api/briefs/open');
    expect(open.body.items.map((b: { id: string }) => b.id)).not.toContain(briefId);
  });

  it('refuses quotes from people who are not drummers (404 when they cannot see the brief)', async () => {
    const briefId = await publishedBrief(songwriter);
    expect((await stranger.post(`/api/briefs/${briefId}/quotes`, quoteBody())).status).toBe(404);
  });

  it('refuses quotes on drafts (404), and on hired briefs (409 to the drummers who can still see it, 404 to the rest)', async () => {
    const draft = (await songwriter.post('/api/briefs', briefBody())).body.brief.id;
    expect((await drummers[0].client.post(`/api/briefs/${draft}/quotes`, quoteBody())).status).toBe(404);
    const briefId = await publishedBrief(songwriter);
    await songwriter.post(`/api/briefs/${briefId}/invites`, { drummerIds: [drummers[1].id] });
    const q = await drummers[0].client.post(`/api/briefs/${briefId}/quotes`, quoteBody());
    expect((await songwriter.post(`/api/quotes/${q.body.quote.id}/accept`)).status).toBe(201);
    // An invited drummer still sees the hired brief and is told it takes no quotes; others no longer see it.
    const late = await drummers[1].client.post(`/api/briefs/${briefId}/quotes`, quoteBody());
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('brief_not_open');
    expect((await drummers[2].client.post(`/api/briefs/${briefId}/quotes`, quoteBody())).status).toBe(404);
  });

  it('checks the rights terms and the engineer pair field by field', async () => {
    const briefId = await publishedBrief(songwriter);
    const c = drummers[2].client;
    const points = await c.post(`/api/briefs/${briefId}/quotes`, quoteBody({ rightsTerms: 'points' }));
    expect(points.body.error.fields).toHaveProperty('royaltyPoints');
    const pair = await c.post(`/api/briefs/${briefId}/quotes`, quoteBody({ engineerId: engineer.id }));
    expect(pair.body.error.fields).toHaveProperty('engineerShareMinor');
    const notEngineer = await c.post(`/api/briefs/${briefId}/quotes`, quoteBody({ engineerId: drummers[0].id, engineerShareMinor: 100 }));
    expect(notEngineer.status).toBe(400);
    expect(notEngineer.body.error.fields).toHaveProperty('engineerId');
    const unknownPackage = await c.post(`/api/briefs/${briefId}/quotes`, quoteBody({ packageId: 'no-such-package' }));
    expect(unknownPackage.status).toBe(400);
    expect(unknownPackage.body.error.fields).toHaveProperty('packageId');
    const past = await c.post(`/api/briefs/${briefId}/quotes`, quoteBody({ recordingDate: '2001-01-01' }));
    expect(past.body.error.fields).toHaveProperty('recordingDate');
    const ok = await c.post(`/api/briefs/${briefId}/quotes`, quoteBody({ rightsTerms: 'points', royaltyPoints: 2.5 }));
    expect(ok.status).toBe(201);
    expect(ok.body.quote).toMatchObject({ rightsTerms: 'points', royaltyPoints: 2.5 });
  });
});

describe('who sees which quotes', () => {
  let briefId: string;
  let q0: string;
  let q1: string;
  beforeAll(async () => {
    briefId = await publishedBrief(songwriter, { songTitle: 'Visibility Song' });
    q0 = (await drummers[0].client.post(`/api/briefs/${briefId}/quotes`, quoteBody({ perSongFeeMinor: 10000 }))).body.quote.id;
    q1 = (await drummers[1].client.post(`/api/briefs/${briefId}/quotes`, quoteBody({ perSongFeeMinor: 20000, turnaroundDays: 3 }))).body.quote.id;
  });

  it('shows the brief’s owner all its quotes side by side with rating and reel fields', async () => {
    const res = await songwriter.get(`/api/briefs/${briefId}/quotes`);
    expect(res.status).toBe(200);
    expect(res.body.items.map((q: { id: string }) => q.id)).toEqual([q0, q1]);
    expect(res.body.items[1]).toMatchObject({ totalMinor: 20000 * 2 + 2500, turnaroundDays: 3, revisionsIncluded: 2, rightsTerms: 'buyout', drummerName: 'Drummer 2' });
    expect(res.body.items[0].drummer).toEqual({ ratingAvg: null, ratingCount: 0, reelTrackId: null, reelTrackTitle: null });
  });

  it('refuses the comparison to a drummer who can see the brief (403) and to anyone else (404)', async () => {
    const asDrummer = await drummers[0].client.get(`/api/briefs/${briefId}/quotes`);
    expect(asDrummer.status).toBe(403);
    expect(JSON.stringify(asDrummer.body)).not.toContain(q1);
    expect((await stranger.get(`/api/briefs/${briefId}/quotes`)).status).toBe(404);
  });

  it('shows a drummer only their own quotes', async () => {
    const mine = await drummers[0].client.get('/api/quotes/mine');
    const ids = mine.body.items.map((q: { id: string }) => q.id);
    expect(ids).toContain(q0);
    expect(ids).not.toContain(q1);
    expect(mine.body.items.every((q: { drummerId: string }) => q.drummerId === drummers[0].id)).toBe(true);
    expect((await drummers[0].client.get(`/api/quotes/${q1}`)).status).toBe(404);
    expect((await stranger.get(`/api/quotes/${q0}`)).status).toBe(404);
    expect((await songwriter.get(`/api/quotes/${q0}`)).status).toBe(200);
  });

  it('lets only the drummer withdraw their quote: the owner gets 403, others 404', async () => {
    expect((await songwriter.post(`/api/quotes/${q1}/withdraw`)).status).toBe(403);
    expect((await drummers[0].client.post(`/api/quotes/${q1}/withdraw`)).status).toBe(404);
    const res = await drummers[1].client.post(`/api/quotes/${q1}/withdraw`);
    expect(res.status).toBe(200);
    expect(res.body.quote.status).toBe('withdrawn');
    expect((await drummers[1].client.post(`/api/quotes/${q1}/withdraw`)).status).toBe(409);
    expect((await songwriter.post(`/api/quotes/${q1}/accept`)).status).toBe(409);
  });

  it('lets only the owner decline, with an optional reason that reaches the drummer', async () => {
    expect((await drummers[0].client.post(`/api/quotes/${q0}/decline`, { reason: 'x' })).status).toBe(403);
    const res = await songwriter.post(`/api/quotes/${q0}/decline`, { reason: 'Looking for a lighter touch' });
    expect(res.status).toBe(200);
    expect(res.body.quote).toMatchObject({ status: 'declined', declineReason: 'Looking for a lighter touch' });
    const mail = await app.waitForMail('d1@example.test', /quote for “Visibility Song” was declined/);
    expect(mail.text).toContain('Looking for a lighter touch');
  });
});

describe('accepting a quote', () => {
  it('in one step declines the others (each drummer told), hires the brief and creates a booking awaiting payment', async () => {
    const briefId = await publishedBrief(songwriter, { songTitle: 'Accept Song', songCount: 2 });
    const ids: string[] = [];
    for (const [i, d] of drummers.entries()) {
      ids.push((await d.client.post(`/api/briefs/${briefId}/quotes`, quoteBody({ perSongFeeMinor: 10000 + i * 1000, rightsTerms: 'credit' }))).body.quote.id);
    }
    const res = await songwriter.post(`/api/quotes/${ids[1]}/accept`);
    expect(res.status).toBe(201);
    const booking = res.body.booking;
    expect(booking).toMatchObject({
      status: 'awaiting_payment',
      quoteId: ids[1],
      briefId,
      totalMinor: 11000 * 2 + 2500,
      drummerShareMinor: 11000 * 2 + 2500,
      engineerShareMinor: 0,
      currency: 'USD',
      drummer: { id: drummers[1].id, displayName: 'Drummer 2' },
      myRole: 'songwriter',
      version: 1,
    });
    expect(booking.terms).toMatchObject({ songTitle: 'Accept Song', rightsTerms: 'credit', revisionsIncluded: 2, turnaroundDays: 7, deliverables: { sampleRate: 48000, bitDepth: '24' } });

    const list = (await songwriter.get(`/api/briefs/${briefId}/quotes`)).body.items;
    expect(list.map((q: { status: string }) => q.status)).toEqual(['declined', 'accepted', 'declined']);
    expect((await songwriter.get(`/api/briefs/${briefId}`)).body.brief.status).toBe('hired');
    await app.waitForMail('d1@example.test', /quote for “Accept Song” was declined/);
    await app.waitForMail('d3@example.test', /quote for “Accept Song” was declined/);
    const won = await app.waitForMail('d2@example.test', /quote for “Accept Song” was accepted/);
    expect(won.links.some((l) => l.endsWith(`/bookings/${booking.id}`))).toBe(true);

    // Nothing else can be accepted now.
    expect((await songwriter.post(`/api/quotes/${ids[0]}/accept`)).status).toBe(409);
  });

  it('keeps the booking’s terms frozen when the quote or brief change later', async () => {
    const briefId = await publishedBrief(songwriter, { songTitle: 'Frozen Song' });
    const quoteId = (await drummers[0].client.post(`/api/briefs/${briefId}/quotes`, quoteBody())).body.quote.id;
    const booking = (await songwriter.post(`/api/quotes/${quoteId}/accept`)).body.booking;
    app.db.update(quotes).set({ totalMinor: 1, turnaroundDays: 99 }).where(eq(quotes.id, quoteId)).run();
    app.db.update(briefs).set({ songTitle: 'Renamed', sampleRate: 96000 }).where(eq(briefs.id, briefId)).run();
    const again = (await songwriter.get(`/api/bookings/${booking.id}`)).body.booking;
    expect(again.terms).toEqual(booking.terms);
    expect(again.totalMinor).toBe(booking.totalMinor);
  });

  it('refuses acceptance by anyone but the brief’s owner', async () => {
    const briefId = await publishedBrief(songwriter);
    const quoteId = (await drummers[0].client.post(`/api/briefs/${briefId}/quotes`, quoteBody())).body.quote.id;
    expect((await drummers[0].client.post(`/api/quotes/${quoteId}/accept`)).status).toBe(403);
    expect((await stranger.post(`/api/quotes/${quoteId}/accept`)).status).toBe(404);
    expect((await app.client().post(`/api/quotes/${quoteId}/accept`)).status).toBe(401);
  });

  it('reads a quote past its validity as expired and will not accept it', async () => {
    const briefId = await publishedBrief(songwriter);
    const quoteId = (await drummers[2].client.post(`/api/briefs/${briefId}/quotes`, quoteBody({ validDays: 1 }))).body.quote.id;
    app.db.update(quotes).set({ validUntil: new Date(Date.now() - 1000) }).where(eq(quotes.id, quoteId)).run();
    expect((await drummers[2].client.get(`/api/quotes/${quoteId}`)).body.quote.status).toBe('expired');
    const res = await songwriter.post(`/api/quotes/${quoteId}/accept`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/expired/);
    expect((await drummers[2].client.post(`/api/quotes/${quoteId}/withdraw`)).status).toBe(409);
  });
});

describe('a quote with an engineer', () => {
  it('cannot be accepted until the named engineer confirms; then the engineer’s share is set on the booking', async () => {
    const briefId = await publishedBrief(songwriter, { songTitle: 'Room Song', songCount: 1, needsRoom: true });
    const created = await drummers[0].client.post(`/api/briefs/${briefId}/quotes`, quoteBody({ perSongFeeMinor: 30000, rushFeeMinor: 0, engineerId: engineer.id, engineerShareMinor: 12000 }));
    expect(created.status).toBe(201);
    const q = created.body.quote;
    expect(q.lineItems).toEqual([
      { kind: 'per_song', label: 'Drum tracks for the song', unitAmount: 30000, quantity: 1 },
      { kind: 'package', label: 'Room, engineer and mic package', unitAmount: 12000, quantity: 1 },
    ]);
    expect(q).toMatchObject({ totalMinor: 42000, drummerShareMinor: 30000, engineer: { id: engineer.id, shareMinor: 12000, status: 'pending' } });
    expect(q.blockedReason).toMatch(/engineer/);
    await app.waitForMail('eng@example.test', /named you as the engineer/);

    const early = await songwriter.post(`/api/quotes/${q.id}/accept`);
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('quote_not_acceptable');

    expect((await drummers[0].client.post(`/api/quotes/${q.id}/engineer-response`, { confirm: true })).status).toBe(403);
    expect((await stranger.post(`/api/quotes/${q.id}/engineer-response`, { confirm: true })).status).toBe(404);
    expect((await engineer.client.post(`/api/quotes/${q.id}/engineer-response`, { confirm: 'yes' })).status).toBe(400);
    const requests = await engineer.client.get('/api/quotes/engineer-requests');
    expect(requests.body.items.map((x: { id: string }) => x.id)).toContain(q.id);

    const confirmed = await engineer.client.post(`/api/quotes/${q.id}/engineer-response`, { confirm: true });
    expect(confirmed.status).toBe(200);
    expect(confirmed.body.quote.engineer.status).toBe('confirmed');
    expect((await engineer.client.post(`/api/quotes/${q.id}/engineer-response`, { confirm: false })).status).toBe(409);

    const accepted = await songwriter.post(`/api/quotes/${q.id}/accept`);
    expect(accepted.status).toBe(201);
    expect(accepted.body.booking).toMatchObject({ totalMinor: 42000, drummerShareMinor: 30000, engineerShareMinor: 12000, engineer: { id: engineer.id } });
    const asEngineer = await engineer.client.get(`/api/bookings/${accepted.body.booking.id}`);
    expect(asEngineer.body.booking.myRole).toBe('engineer');
  });

  it('stays unacceptable when the engineer declines', async () => {
    const briefId = await publishedBrief(songwriter);
    const q = (await drummers[1].client.post(`/api/briefs/${briefId}/quotes`, quoteBody({ engineerId: engineer.id, engineerShareMinor: 5000 }))).body.quote;
    const res = await engineer.client.post(`/api/quotes/${q.id}/engineer-response`, { confirm: false });
    expect(res.body.quote.engineer.status).toBe('declined');
    expect(res.body.quote.blockedReason).toMatch(/declined/);
    expect((await songwriter.post(`/api/quotes/${q.id}/accept`)).status).toBe(409);
  });
});

describe('bookings', () => {
  let bookingId: string;
  beforeAll(async () => {
    const briefId = await publishedBrief(songwriter, { songTitle: 'Booking Song' });
    const quoteId = (await drummers[2].client.post(`/api/briefs/${briefId}/quotes`, quoteBody())).body.quote.id;
    bookingId = (await songwriter.post(`/api/quotes/${quoteId}/accept`)).body.booking.id;
  });

  it('lists a person’s bookings as songwriter or drummer, and all of them only for an admin who asks', async () => {
    const asSongwriter = await songwriter.get('/api/bookings');
    expect(asSongwriter.body.items.map((b: { id: string }) => b.id)).toContain(bookingId);
    const asDrummer = await drummers[2].client.get('/api/bookings');
    expect(asDrummer.body.items.map((b: { id: string }) => b.id)).toEqual([bookingId]);
    expect(asDrummer.body.items[0].myRole).toBe('drummer');
    const strangerAll = await stranger.get('/api/bookings?all=1');
    expect(strangerAll.body.items).toEqual([]);
    const adminAll = await admin.get('/api/bookings?all=1');
    expect(adminAll.body.total).toBe(asSongwriter.body.total);
    expect(adminAll.body.items.find((b: { id: string }) => b.id === bookingId).myRole).toBe('admin');
    expect((await admin.get('/api/bookings')).body.items).toEqual([]);
    expect((await admin.get('/api/bookings?all=maybe')).status).toBe(400);
  });

  it('shows a booking to its parties and admins only (404 for everyone else)', async () => {
    expect((await drummers[2].client.get(`/api/bookings/${bookingId}`)).status).toBe(200);
    expect((await admin.get(`/api/bookings/${bookingId}`)).status).toBe(200);
    expect((await drummers[0].client.get(`/api/bookings/${bookingId}`)).status).toBe(404);
    expect((await stranger.get(`/api/bookings/${bookingId}`)).status).toBe(404);
    expect((await app.client().get(`/api/bookings/${bookingId}`)).status).toBe(401);
  });

  it('moves a booking on with transitionBooking only from an allowed state, bumping its version', () => {
    const funded = inTransaction(app.db, (tx) => transitionBooking(tx, bookingId, ['awaiting_payment'], 'funded'));
    expect(funded).toMatchObject({ status: 'funded', version: 2 });
    expect(() => inTransaction(app.db, (tx) => transitionBooking(tx, bookingId, ['awaiting_payment'], 'cancelled'))).toThrow(/funded/);
    const row = app.db.select().from(bookings).where(eq(bookings.id, bookingId)).get();
    expect(row).toMatchObject({ status: 'funded', version: 2 });
    expect(() => inTransaction(app.db, (tx) => transitionBooking(tx, 'nope', ['funded'], 'recording'))).toThrow(/not found/);
  });
});
