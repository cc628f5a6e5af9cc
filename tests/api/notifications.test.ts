import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signUp, startTestApp, type ApiClient, type TestApp } from './helpers/test-app';
import type { NotifyInput } from '../../server/features/notifications/notifications.service';

// Notifications are raised by other features (quotes, briefs, bookings) through ctx.notifications.notify;
// here they are raised directly so the bell and the settings can be tested on their own.
let app: TestApp;
type Person = { client: ApiClient; id: string; email: string };
let alice: Person;
let bob: Person;

async function person(email: string, roles: string[]): Promise<Person> {
  const { client, user } = await signUp(app, { email, roles });
  return { client, id: user.id, email };
}

function notify(userId: string, input: Partial<NotifyInput> & { title: string }) {
  app.kitlane.ctx.notifications.notify(userId, { kind: 'quote_received', link: '/briefs/mine', ...input });
}

beforeAll(async () => {
  app = await startTestApp();
  alice = await person('alice@example.test', ['songwriter']);
  bob = await person('bob@example.test', ['drummer']);
});
afterAll(async () => {
  await app?.close();
});

describe('the bell', () => {
  it('lists my notifications newest first with the unread count', async () => {
    notify(alice.id, { title: 'First quote arrived', body: 'A drummer quoted on Harbour Lights' });
    notify(alice.id, { title: 'Second quote arrived', link: '/briefs/abc' });
    notify(bob.id, { title: 'Not for Alice', kind: 'brief_invite' });

    const res = await alice.client.get('/api/notifications');
    expect(res.status).toBe(200);
    expect(res.body.unread).toBe(2);
    expect(res.body.items.map((n: { title: string }) => n.title)).toEqual(['Second quote arrived', 'First quote arrived']);
    expect(res.body.items[1]).toMatchObject({ kind: 'quote_received', body: 'A drummer quoted on Harbour Lights', link: '/briefs/mine', readAt: null });
    expect(JSON.stringify(res.body)).not.toContain('Not for Alice');
    expect((await alice.client.get('/api/unread')).body).toEqual({ messages: 0, notifications: 2 });
  });

  it('marks one notification read, then all', async () => {
    const list = (await alice.client.get('/api/notifications')).body;
    const one = await alice.client.post('/api/notifications/read', { id: list.items[0].id });
    expect(one.status).toBe(200);
    expect(one.body.unread).toBe(list.unread - 1);
    const after = (await alice.client.get('/api/notifications')).body;
    expect(after.items[0].readAt).not.toBeNull();
    const all = await alice.client.post('/api/notifications/read', {});
    expect(all.body.unread).toBe(0);
    expect((await alice.client.get('/api/unread')).body.notifications).toBe(0);
  });

  it('does not let someone mark another person’s notification read (404)', async () => {
    notify(bob.id, { title: 'Bob only' });
    const bobs = (await bob.client.get('/api/notifications')).body.items as { id: string; title: string }[];
    const target = bobs.find((n) => n.title === 'Bob only')!;
    const res = await alice.client.post('/api/notifications/read', { id: target.id });
    expect(res.status).toBe(404);
    const still = (await bob.client.get('/api/notifications')).body.items.find((n: { id: string }) => n.id === target.id);
    expect(still.readAt).toBeNull();
  });

  it('answers 401 when signed out and 400 to bad input', async () => {
    expect((await app.client().get('/api/notifications')).status).toBe(401);
    expect((await app.client().get('/api/unread')).status).toBe(401);
    expect((await alice.client.post('/api/notifications/read', { id: 7 })).status).toBe(400);
    expect((await alice.client.get('/api/notifications?limit=0')).status).toBe(400);
  });
});

describe('mail and its unsubscribe link', () => {
  it('mails a notification with a link into the app and a footer link to stop that kind', async () => {
    notify(alice.id, { title: 'Your brief has a new quote', link: '/briefs/xyz/quotes', body: 'Open it to compare.' });
    const mail = await app.waitForMail(alice.email, /Your brief has a new quote/);
    expect(mail.links).toContain('http://kitlane.test/briefs/xyz/quotes');
    expect(mail.links).toContain('http://kitlane.test/notifications/settings?mute=quote_received');
    expect(mail.text).toContain('new quotes on my briefs');
  });

  it('stores muted kinds per person; a muted kind still shows in the bell but is not mailed', async () => {
    const put = await bob.client.put('/api/notifications/settings', { mutedKinds: ['brief_invite', 'message_digest', 'brief_invite'] });
    expect(put.status).toBe(200);
    expect([...put.body.mutedKinds].sort()).toEqual(['brief_invite', 'message_digest']);
    expect((await bob.client.get('/api/notifications/settings')).body.mutedKinds.sort()).toEqual(['brief_invite', 'message_digest']);
    expect((await alice.client.get('/api/notifications/settings')).body.mutedKinds).toEqual([]);

    notify(bob.id, { title: 'Muted invitation', kind: 'brief_invite' });
    notify(bob.id, { title: 'Unmuted quote news', kind: 'quote_accepted' });
    await app.waitForMail(bob.email, /Unmuted quote news/);
    await app.kitlane.ctx.jobs.drain();
    expect(app.mail!.messages().some((m) => m.subject === 'Muted invitation')).toBe(false);
    const titles = (await bob.client.get('/api/notifications')).body.items.map((n: { title: string }) => n.title);
    expect(titles).toContain('Muted invitation');

    const cleared = await bob.client.put('/api/notifications/settings', { mutedKinds: [] });
    expect(cleared.body.mutedKinds).toEqual([]);
  });

  it('refuses an unknown kind with a field error', async () => {
    const res = await bob.client.put('/api/notifications/settings', { mutedKinds: ['everything'] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['mutedKinds.0']).toBeTruthy();
    expect((await app.client().put('/api/notifications/settings', { mutedKinds: [] })).status).toBe(401);
  });
});
