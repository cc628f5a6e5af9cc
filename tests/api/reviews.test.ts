// Reviews (issue 4): after paid_out the songwriter rates and reviews the drummer (and the engineer), once
// per booking and person; the drummer profile's rating figures follow in the same transaction.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { startTestApp, type TestApp } from './helpers/test-app';
import { bookingStatus, fundBooking, insertBooking, moveBooking, onboard, person, waitUntil, type Person } from './helpers/money';
import { drummerProfiles } from '../../server/db/schema';

let app: TestApp;
let songwriter: Person;
let drummer: Person;
let engineer: Person;
let outsider: Person;

const review = (rating: number, subjectRole = 'drummer') => ({ subjectRole, rating, text: `Rated ${rating}: tight playing, clean stems.` });
const profileOf = (id: string) => app.db.select().from(drummerProfiles).where(eq(drummerProfiles.userId, id)).get();

/** A booking that went through the money path to paid_out. */
async function paidOutBooking(engineerId: string | null = null): Promise<string> {
  const id = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id, engineerId, totalMinor: 20_000, engineerShareMinor: 5_000 });
  await fundBooking(app, songwriter, id);
  moveBooking(app.db, id, ['recording', 'delivered']);
  const release = await songwriter.client.post(`/api/bookings/${id}/release`, { reason: 'Delivery accepted' });
  if (release.status !== 200) throw new Error(`release failed: ${release.status} ${JSON.stringify(release.body)}`);
  await waitUntil('the booking to be paid out', () => bookingStatus(app.db, id) === 'paid_out');
  return id;
}

beforeAll(async () => {
  app = await startTestApp();
  [songwriter, drummer, engineer, outsider] = await Promise.all([
    person(app, 'sw@example.test', ['songwriter'], 'Nell Songwriter'),
    person(app, 'dr@example.test', ['drummer'], 'Odo Drummer'),
    person(app, 'eng@example.test', ['engineer'], 'Ivo Engineer'),
    person(app, 'out@example.test', ['songwriter', 'drummer'], 'Uma Outsider'),
  ]);
  const profile = await drummer.client.put('/api/profile/drummer', {
    headline: 'Tight pocket, warm kit',
    bio: 'Session drummer for indie and soul records.',
    styles: ['soul'],
    tags: [],
    kit: 'Vintage-style four-piece kit',
    baseRateMinor: 15_000,
    currency: 'USD',
    turnaroundDays: 7,
    revisionsIncluded: 2,
    takingWork: true,
    town: 'Quillmouth',
    country: 'GB',
    timeZone: 'Europe/London',
    published: true,
  });
  if (profile.status !== 200) throw new Error(`profile failed: ${profile.status} ${JSON.stringify(profile.body)}`);
  await Promise.all([onboard(app, drummer), onboard(app, engineer)]);
});
afterAll(async () => {
  await app?.close();
});

describe('reviewing after paid out', () => {
  it('rates the drummer and the engineer; the drummer profile’s average and count follow', async () => {
    const id = await paidOutBooking(engineer.id);
    const before = await songwriter.client.get(`/api/bookings/${id}/reviews`);
    expect(before.body).toEqual({ items: [], canReview: ['drummer', 'engineer'] });

    const res = await songwriter.client.post(`/api/bookings/${id}/reviews`, review(5));
    expect(res.status).toBe(201);
    expect(res.body.review).toMatchObject({ bookingId: id, rating: 5, subject: { id: drummer.id, role: 'drummer' }, reviewer: { id: songwriter.id } });
    expect(profileOf(drummer.id)).toMatchObject({ ratingAvg: 5, ratingCount: 1 });
    expect((await songwriter.client.post(`/api/bookings/${id}/reviews`, review(3, 'engineer'))).status).toBe(201);

    const second = await paidOutBooking();
    expect((await songwriter.client.post(`/api/bookings/${second}/reviews`, review(2))).status).toBe(201);
    // (5 + 2) / 2 = 3.5
    expect(profileOf(drummer.id)).toMatchObject({ ratingAvg: 3.5, ratingCount: 2 });

    const onProfile = await app.client().get(`/api/drummers/${drummer.id}/reviews`);
    expect(onProfile.status).toBe(200);
    expect(onProfile.body).toMatchObject({ ratingAvg: 3.5, ratingCount: 2 });
    expect(onProfile.body.items.map((r: { rating: number }) => r.rating)).toEqual([2, 5]);
    const engineerProfile = await app.client().get(`/api/engineers/${engineer.id}/reviews`);
    expect(engineerProfile.body).toMatchObject({ ratingAvg: 3, ratingCount: 1 });
    expect((await songwriter.client.get(`/api/bookings/${id}/reviews`)).body.canReview).toEqual([]);
    await app.waitForMail(drummer.email, /Nell Songwriter reviewed you: 5 of 5/);
  });

  it('answers 409 to a second review of the same person on the same booking, and keeps the figures', async () => {
    const id = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id });
    moveBooking(app.db, id, ['funded', 'recording', 'delivered', 'accepted', 'paid_out']);
    expect((await songwriter.client.post(`/api/bookings/${id}/reviews`, review(4))).status).toBe(201);
    const counted = profileOf(drummer.id)!.ratingCount;
    const again = await songwriter.client.post(`/api/bookings/${id}/reviews`, review(1));
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('review_exists');
    expect(profileOf(drummer.id)!.ratingCount).toBe(counted);
  });
});

describe('who may review what, when', () => {
  it('refuses before paid out (409), the drummer (403), outsiders (404) and signed-out people (401)', async () => {
    const id = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id });
    moveBooking(app.db, id, ['funded', 'recording', 'delivered']);
    const early = await songwriter.client.post(`/api/bookings/${id}/reviews`, review(5));
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('booking_not_paid_out');
    moveBooking(app.db, id, ['accepted', 'paid_out']);
    expect((await drummer.client.post(`/api/bookings/${id}/reviews`, review(5))).status).toBe(403);
    expect((await outsider.client.post(`/api/bookings/${id}/reviews`, review(1))).status).toBe(404);
    expect((await outsider.client.get(`/api/bookings/${id}/reviews`)).status).toBe(404);
    expect((await app.client().post(`/api/bookings/${id}/reviews`, review(5))).status).toBe(401);
    expect((await drummer.client.get(`/api/bookings/${id}/reviews`)).body.canReview).toEqual([]);
  });

  it('checks the input: 1 to 5 whole stars, some words, and an engineer only when there was one', async () => {
    const id = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id });
    moveBooking(app.db, id, ['funded', 'recording', 'delivered', 'accepted', 'paid_out']);
    for (const rating of [0, 6, 4.5]) {
      const res = await songwriter.client.post(`/api/bookings/${id}/reviews`, review(rating));
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toHaveProperty('rating');
    }
    expect((await songwriter.client.post(`/api/bookings/${id}/reviews`, { subjectRole: 'drummer', rating: 4, text: 'ok' })).body.error.fields).toHaveProperty('text');
    const noEngineer = await songwriter.client.post(`/api/bookings/${id}/reviews`, review(4, 'engineer'));
    expect(noEngineer.status).toBe(400);
    expect(noEngineer.body.error.fields).toHaveProperty('subjectRole');
    expect((await app.client().get('/api/drummers/nobody/reviews')).status).toBe(404);
    expect((await app.client().get(`/api/engineers/${drummer.id}/reviews`)).status).toBe(404);
  });
});
