import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from './helpers/test-app';
import { insertBooking, person } from './helpers/money';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app?.close();
});

describe('session prep on a booking without a room', () => {
  it('answers "no checklist" to the parties, 404 to strangers, and refuses ticks', async () => {
    const songwriter = await person(app, 'np-sw@example.test', ['songwriter'], 'Nora Songwriter');
    const drummer = await person(app, 'np-dr@example.test', ['drummer'], 'Dov Drummer');
    const stranger = await person(app, 'np-x@example.test', ['drummer'], 'Sam Stranger');
    const bookingId = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id });
    const res = await songwriter.client.get(`/api/bookings/${bookingId}/prep`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ prep: null });
    expect((await stranger.client.get(`/api/bookings/${bookingId}/prep`)).status).toBe(404);
    expect((await drummer.client.put(`/api/bookings/${bookingId}/prep/no_squeaks`, { done: true })).status).toBe(404);
  });
});
