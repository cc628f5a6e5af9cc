import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signUp, startTestApp, type ApiClient, type TestApp } from './helpers/test-app';

let app: TestApp;
const ids: Record<string, string> = {};
const clients: Record<string, ApiClient> = {};

const base = {
  bio: '',
  tags: [] as string[],
  kit: '',
  revisionsIncluded: 2,
  takingWork: true,
  town: '',
  country: '',
  published: true,
};

// A small invented field of drummers; the made-up word "quorble" marks the ones made for this file.
const field = {
  alba: { name: 'Alba Quorble', headline: 'Quorble rock drummer with a heavy foot', styles: ['rock', 'metal'], baseRateMinor: 20000, currency: 'USD', turnaroundDays: 3, timeZone: 'America/Chicago' },
  bram: { name: 'Bram Ostley', headline: 'Brushes and swing for quorble jazz trios', styles: ['jazz'], baseRateMinor: 35000, currency: 'USD', turnaroundDays: 10, timeZone: 'Europe/Berlin', bio: 'Plays with a quorble feel.' },
  cato: { name: 'Cato Vrell', headline: 'Funk pocket, quorble ghost notes', styles: ['funk', 'soul'], baseRateMinor: 15000, currency: 'USD', turnaroundDays: 5, timeZone: 'Asia/Tokyo', takingWork: false },
  dema: { name: 'Dema Ruusk', headline: 'Euro-priced quorble pop', styles: ['pop'], baseRateMinor: 18000, currency: 'EUR', turnaroundDays: 4, timeZone: 'Europe/Lisbon', kit: 'steel snare and a quorble tambourine' },
  hidden: { name: 'Hidden Quorble', headline: 'Quorble but unpublished', styles: ['rock'], baseRateMinor: 1000, currency: 'USD', turnaroundDays: 1, timeZone: 'UTC', published: false },
};

beforeAll(async () => {
  app = await startTestApp();
  for (const [key, d] of Object.entries(field)) {
    const { client, user } = await signUp(app, { email: `${key}@search.test`, roles: ['drummer'], displayName: d.name });
    const { name: _name, ...profile } = d;
    const res = await client.put('/api/profile/drummer', { ...base, ...profile });
    if (res.status !== 200) throw new Error(`profile for ${key}: ${JSON.stringify(res.body)}`);
    ids[key] = user.id;
    clients[key] = client;
  }
});
afterAll(async () => {
  await app?.close();
});

async function search(query: string) {
  return app.client().get(`/api/drummers?${query}`);
}
const names = (body: { items: { displayName: string }[] }) => body.items.map((i) => i.displayName);

describe('searching drummers by words', () => {
  it('finds published profiles only, with the fixed item shape', async () => {
    const res = await search('q=quorble');
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(4);
    expect(names(res.body)).not.toContain('Hidden Quorble');
    expect(res.body.items.find((i: { id: string }) => i.id === ids.alba)).toEqual({
      id: ids.alba,
      displayName: 'Alba Quorble',
      headline: 'Quorble rock drummer with a heavy foot',
      styles: ['rock', 'metal'],
      baseRateMinor: 20000,
      currency: 'USD',
      turnaroundDays: 3,
      takingWork: true,
      town: '',
      country: '',
      timeZone: 'America/Chicago',
      ratingAvg: null,
      ratingCount: 0,
    });
  });

  it('ranks a name hit above a headline hit above a bio hit', async () => {
    const res = await search('q=quorble&sort=best');
    expect(res.body.items[0].displayName).toBe('Alba Quorble');
  });

  it('searches bio, styles, tags and kit, and matches word prefixes', async () => {
    expect(names((await search('q=tambourine')).body)).toEqual(['Dema Ruusk']);
    expect(names((await search('q=swin')).body)).toEqual(['Bram Ostley']);
    expect(names((await search('q=soul')).body)).toEqual(['Cato Vrell']);
    expect(names((await search('q=ghost%20notes%20funk')).body)).toEqual(['Cato Vrell']);
  });

  it('treats FTS syntax and quotes as plain words, never an error', async () => {
    for (const q of ['"quorble', 'quorble*', 'quorble AND', 'NEAR(quorble', '-quorble', 'headline:quorble', '(((', '"', '*', 'NOT', "'; DROP TABLE users; --"]) {
      const res = await search(`q=${encodeURIComponent(q)}`);
      expect(res.status, q).toBe(200);
      expect(Array.isArray(res.body.items), q).toBe(true);
    }
    expect((await search(`q=${encodeURIComponent('"quorble" -jazz')}`)).body.total).toBe(1);
    // Only punctuation left: no words, so every listed drummer answers.
    expect((await search(`q=${encodeURIComponent('"*" :')}`)).body.total).toBe((await search('')).body.total);
  });

  it('follows a change of display name', async () => {
    const res = await clients.bram.patch('/api/account', { displayName: 'Bram Zephyrine', roles: ['drummer'], timeZone: 'Europe/Berlin' });
    expect(res.status).toBe(200);
    expect(names((await search('q=zephyrine')).body)).toEqual(['Bram Zephyrine']);
    expect((await search('q=ostley')).body.total).toBe(0);
  });
});

describe('filters, sorting and paging', () => {
  it('filters by style, rate in a currency, turnaround, taking work and time zone band', async () => {
    expect(names((await search('q=quorble&style=jazz')).body)).toEqual(['Bram Zephyrine']);
    expect(names((await search('q=quorble&maxRate=200&currency=USD&sort=rate')).body)).toEqual(['Cato Vrell', 'Alba Quorble']);
    expect(names((await search('q=quorble&maxRate=180&currency=EUR')).body)).toEqual(['Dema Ruusk']);
    expect(names((await search('q=quorble&maxTurnaround=4&sort=turnaround')).body)).toEqual(['Alba Quorble', 'Dema Ruusk']);
    expect(names((await search('q=quorble&takingWork=true')).body)).not.toContain('Cato Vrell');
    expect(names((await search('q=quorble&takingWork=false')).body)).toEqual(['Cato Vrell']);
    expect(names((await search('q=quorble&tzBand=americas')).body)).toEqual(['Alba Quorble']);
    expect(names((await search('q=quorble&tzBand=asia-pacific')).body)).toEqual(['Cato Vrell']);
    expect(names((await search('q=quorble&tzBand=europe-africa&sort=rate')).body)).toEqual(['Dema Ruusk', 'Bram Zephyrine']);
  });

  it('treats empty parameters as no filter', async () => {
    const all = await search('q=quorble');
    const empty = await search('q=quorble&style=&maxRate=&currency=&maxTurnaround=&takingWork=&tzBand=&sort=&page=&pageSize=');
    expect(empty.status).toBe(200);
    expect(empty.body.total).toBe(all.body.total);
  });

  it('pages through results with a stable order and the total', async () => {
    const first = await search('q=quorble&sort=rate&pageSize=2&page=1');
    const second = await search('q=quorble&sort=rate&pageSize=2&page=2');
    const beyond = await search('q=quorble&sort=rate&pageSize=2&page=9');
    expect(first.body.total).toBe(4);
    expect(first.body.items).toHaveLength(2);
    expect(second.body.items).toHaveLength(2);
    expect(new Set([...names(first.body), ...names(second.body)]).size).toBe(4);
    expect(beyond.body).toEqual({ items: [], total: 4 });
  });

  it('answers 400 with a field message for bad filters, never 500', async () => {
    const noCurrency = await search('maxRate=100');
    expect(noCurrency.status).toBe(400);
    expect(noCurrency.body.error.fields.currency).toMatch(/currency/);
    for (const q of ['sort=cheapest', 'page=0', 'pageSize=500', 'style=polka', 'tzBand=moon', 'maxRate=abc&currency=USD', 'takingWork=maybe', 'currency=XXX']) {
      const res = await search(q);
      expect(res.status, q).toBe(400);
    }
    const long = await search(`q=${'quorble '.repeat(100)}`);
    expect(long.status).toBe(200);
  });
});

describe('search results and reels', () => {
  it('carries the first reel track of a drummer who has one', async () => {
    const form = new FormData();
    form.append('title', 'Search reel');
    const { synthReelWav } = await import('../../server/features/reels/reel-synth');
    form.append('file', new Blob([new Uint8Array(synthReelWav({ seconds: 1, tempo: 100 }))], { type: 'audio/wav' }), 'r.wav');
    const cookie = (clients.alba as unknown as { cookie: string }).cookie;
    const up = await fetch(`${app.url}/api/reel-tracks`, { method: 'POST', body: form, headers: { cookie } });
    expect(up.status).toBe(201);
    const track = (await up.json()).track;
    const res = await search('q=alba');
    expect(res.body.items[0].reelTrackId).toBe(track.id);
    expect(res.body.items.find((i: { id: string }) => i.id === ids.bram)).toBeUndefined();
  });

  it('hides a profile again once it is unpublished', async () => {
    await clients.dema.put('/api/profile/drummer', { ...base, ...field.dema, name: undefined, published: false });
    expect((await search('q=tambourine')).body.total).toBe(0);
  });
});
