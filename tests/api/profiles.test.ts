import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signUp, startTestApp, type TestApp } from './helpers/test-app';

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app?.close();
});

const profile = {
  headline: 'Tight funk with ghost notes',
  bio: 'I play for the song.',
  styles: ['funk', 'soul'],
  tags: ['Ghost Notes', 'pocket'],
  kit: '20" kick, 12" rack tom, 14" floor tom, wooden snare',
  baseRateMinor: 25000,
  currency: 'USD',
  turnaroundDays: 4,
  revisionsIncluded: 2,
  takingWork: true,
  town: 'Fennick Cross',
  country: 'us',
  timeZone: 'America/Chicago',
  published: true,
};

describe('drummer profile (own)', () => {
  it('starts from defaults, saves, and stores the standard UTC offset of the time zone', async () => {
    const { client } = await signUp(app, { email: 'd1@example.test', roles: ['drummer'], displayName: 'Delia Ferro' });
    const empty = await client.get('/api/profile/drummer');
    expect(empty.status).toBe(200);
    expect(empty.body.profile).toMatchObject({ headline: '', published: false, listed: false, updatedAt: null, displayName: 'Delia Ferro' });
    expect(empty.body.reelTracks).toEqual([]);

    const saved = await client.put('/api/profile/drummer', profile);
    expect(saved.status).toBe(200);
    expect(saved.body.profile).toMatchObject({
      headline: 'Tight funk with ghost notes',
      tags: ['ghost notes', 'pocket'],
      country: 'US',
      timeZone: 'America/Chicago',
      utcOffsetMinutes: -360,
      listed: true,
    });
    expect(saved.body.profile.updatedAt).toEqual(expect.any(String));
    const again = await client.get('/api/profile/drummer');
    expect(again.body.profile).toEqual(saved.body.profile);
  });

  it('answers 400 with field messages for bad input, never 500', async () => {
    const { client } = await signUp(app, { email: 'd2@example.test', roles: ['drummer'] });
    const bad = await client.put('/api/profile/drummer', {
      ...profile,
      styles: ['polka-core'],
      baseRateMinor: 12.5,
      currency: 'XXX',
      timeZone: 'Mars/Olympus',
      turnaroundDays: 0,
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['baseRateMinor', 'currency', 'styles.0', 'timeZone', 'turnaroundDays']);
    const junk = await client.request('PUT', '/api/profile/drummer', 'not json at all');
    expect(junk.status).toBe(400);
    const extra = await client.put('/api/profile/drummer', { ...profile, ratingAvg: 5 });
    expect(extra.status).toBe(400);
  });

  it('refuses a drummer profile to a songwriter and to a visitor', async () => {
    const { client } = await signUp(app, { email: 's1@example.test', roles: ['songwriter'] });
    expect((await client.get('/api/profile/drummer')).status).toBe(403);
    expect((await client.put('/api/profile/drummer', profile)).status).toBe(403);
    const visitor = app.client();
    expect((await visitor.get('/api/profile/drummer')).status).toBe(401);
    expect((await visitor.put('/api/profile/drummer', { nonsense: true })).status).toBe(401);
  });

  it('lets an unverified drummer keep a draft but not publish it', async () => {
    const { client } = await signUp(app, { email: 'd3@example.test', roles: ['drummer'], verify: false });
    expect((await client.put('/api/profile/drummer', { ...profile, published: false })).status).toBe(200);
    const publish = await client.put('/api/profile/drummer', profile);
    expect(publish.status).toBe(403);
    expect(publish.body.error.code).toBe('email_unverified');
  });
});

describe('public drummer page', () => {
  it('shows a published profile to anyone, without private fields', async () => {
    const { client, user } = await signUp(app, { email: 'd4@example.test', roles: ['drummer'], displayName: 'Ravi Tamsel' });
    await client.put('/api/profile/drummer', profile);
    const res = await app.client().get(`/api/drummers/${user.id}`);
    expect(res.status).toBe(200);
    expect(res.body.drummer).toMatchObject({ id: user.id, displayName: 'Ravi Tamsel', headline: profile.headline, ratingAvg: null, ratingCount: 0, reelTracks: [], isEngineer: false });
    expect(res.body.drummer).not.toHaveProperty('published');
    expect(res.body.drummer).not.toHaveProperty('email');
  });

  it('hides an unpublished or headline-less profile from others (404) but not from its owner', async () => {
    const { client, user } = await signUp(app, { email: 'd5@example.test', roles: ['drummer'] });
    await client.put('/api/profile/drummer', { ...profile, published: false });
    const stranger = (await signUp(app, { email: 's2@example.test', roles: ['songwriter'] })).client;
    expect((await stranger.get(`/api/drummers/${user.id}`)).status).toBe(404);
    expect((await app.client().get(`/api/drummers/${user.id}`)).status).toBe(404);
    expect((await client.get(`/api/drummers/${user.id}`)).status).toBe(200);

    await client.put('/api/profile/drummer', { ...profile, headline: '', published: true });
    const own = await client.get('/api/profile/drummer');
    expect(own.body.profile).toMatchObject({ published: true, listed: false });
    expect((await stranger.get(`/api/drummers/${user.id}`)).status).toBe(404);
  });

  it('answers 404 for an id that is no drummer', async () => {
    const { user } = await signUp(app, { email: 's3@example.test', roles: ['songwriter'] });
    expect((await app.client().get(`/api/drummers/${user.id}`)).status).toBe(404);
    expect((await app.client().get('/api/drummers/not-an-id')).status).toBe(404);
  });
});

describe('engineer profile', () => {
  const engineer = { headline: 'Tracking in a wooden room', bio: 'Close and far mics.', services: ['tracking', 'mixing'], town: 'Tarnholm', country: 'DE', timeZone: 'Europe/Berlin' };

  it('saves an engineer profile and shows it publicly with a place for rooms', async () => {
    const { client, user } = await signUp(app, { email: 'e1@example.test', roles: ['engineer'], displayName: 'Ada Rellin' });
    const saved = await client.put('/api/profile/engineer', engineer);
    expect(saved.status).toBe(200);
    expect(saved.body.profile).toMatchObject({ ...engineer, listed: true });
    const pub = await app.client().get(`/api/engineers/${user.id}`);
    expect(pub.status).toBe(200);
    expect(pub.body.engineer).toMatchObject({ id: user.id, displayName: 'Ada Rellin', services: ['tracking', 'mixing'], rooms: [], isDrummer: false });
  });

  it('links the two profiles of someone who is drummer and engineer', async () => {
    const { client, user } = await signUp(app, { email: 'de1@example.test', roles: ['drummer', 'engineer'] });
    await client.put('/api/profile/drummer', profile);
    await client.put('/api/profile/engineer', engineer);
    expect((await app.client().get(`/api/drummers/${user.id}`)).body.drummer.isEngineer).toBe(true);
    expect((await app.client().get(`/api/engineers/${user.id}`)).body.engineer.isDrummer).toBe(true);
  });

  it('refuses an engineer profile to a drummer-only account and hides empty ones', async () => {
    const { client, user } = await signUp(app, { email: 'd6@example.test', roles: ['drummer'] });
    expect((await client.put('/api/profile/engineer', engineer)).status).toBe(403);
    expect((await app.client().get(`/api/engineers/${user.id}`)).status).toBe(404);
    const e2 = await signUp(app, { email: 'e2@example.test', roles: ['engineer'] });
    await e2.client.put('/api/profile/engineer', { ...engineer, headline: '' });
    expect((await app.client().get(`/api/engineers/${e2.user.id}`)).status).toBe(404);
    const bad = await e2.client.put('/api/profile/engineer', { ...engineer, services: ['catering'] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields['services.0']).toBeTruthy();
  });
});
