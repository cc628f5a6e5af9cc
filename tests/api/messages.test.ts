import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { randomUUID } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { eq } from 'drizzle-orm';
import { signUp, startTestApp, type ApiClient, type TestApp } from './helpers/test-app';
import { bookings, briefs, jobs, notificationMutes, quotes } from '../../server/db/schema';
import { DIGEST_JOB } from '../../server/features/messages/messages.digest';
import { messagesSeedStep } from '../../server/features/messages/messages.seed';

// Briefs and bookings are written straight into the database here: these tests are about conversations,
// and the brief/booking rules have their own tests. The states used are the ones DESIGN.md names.
type BriefStatus = (typeof briefs.$inferSelect)['status'];

let app: TestApp;
type Person = { client: ApiClient; id: string; email: string };
let songwriter: Person;
let otherSongwriter: Person;
let drummer: Person;
let secondDrummer: Person;
let engineer: Person;
let outsider: Person;

const DIGEST_DELAY_MS = 800;

async function person(email: string, roles: string[], displayName: string): Promise<Person> {
  const { client, user } = await signUp(app, { email, roles, displayName });
  return { client, id: user.id, email };
}

function insertBrief(songwriterId: string, status: BriefStatus, songTitle = 'Lantern Song'): string {
  const id = randomUUID();
  const now = new Date();
  app.db
    .insert(briefs)
    .values({ id, songwriterId, status, songTitle, tempoBpm: 96, budgetMinMinor: 20000, budgetMaxMinor: 40000, currency: 'USD', deadline: '2031-05-01', createdAt: now, updatedAt: now, publishedAt: status === 'draft' ? null : now })
    .run();
  return id;
}

function insertBooking(opts: { songwriterId: string; drummerId: string; engineerId?: string }): string {
  const briefId = insertBrief(opts.songwriterId, 'hired', 'Copper Tide');
  const quoteId = randomUUID();
  const now = new Date();
  const lineItems = [{ kind: 'per_song' as const, label: 'Per song', unitAmount: 30000, quantity: 1 }];
  app.db
    .insert(quotes)
    .values({ id: quoteId, briefId, drummerId: opts.drummerId, status: 'accepted', lineItems, totalMinor: 30000, currency: 'USD', revisionsIncluded: 2, turnaroundDays: 7, rightsTerms: 'buyout', validUntil: new Date(Date.now() + 86_400_000), createdAt: now, updatedAt: now })
    .run();
  const id = randomUUID();
  app.db
    .insert(bookings)
    .values({
      id,
      briefId,
      quoteId,
      songwriterId: opts.songwriterId,
      drummerId: opts.drummerId,
      engineerId: opts.engineerId ?? null,
      terms: {
        songTitle: 'Copper Tide',
        lineItems,
        totalMinor: 30000,
        currency: 'USD',
        revisionsIncluded: 2,
        extraRevisionMinor: 0,
        turnaroundDays: 7,
        recordingDate: null,
        rightsTerms: 'buyout',
        royaltyPoints: null,
        deliverables: { sampleRate: 48000, bitDepth: '24', stemMode: 'every_mic', stemList: [], roughMix: false },
        tempoBpm: 96,
        timeSignature: '4/4',
        lengthBars: null,
        lengthSeconds: 200,
        packageName: null,
      },
      totalMinor: 30000,
      currency: 'USD',
      drummerShareMinor: 30000,
      createdAt: now,
      updatedAt: now,
    })
    .run();
  return id;
}

async function briefThread(who: Person, briefId: string, drummerId?: string) {
  return who.client.post(`/api/briefs/${briefId}/thread`, drummerId ? { drummerId } : {});
}

async function send(who: Person, threadId: string, body: string) {
  return who.client.post(`/api/threads/${threadId}/messages`, { body });
}

/** A multipart body from FormData: fetch sets the multipart content type and boundary itself. */
async function sendFile(who: Person, threadId: string, file: { bytes: Uint8Array; name: string; type?: string }, body = '') {
  const form = new FormData();
  form.set('body', body);
  form.set('file', new Blob([new Uint8Array(file.bytes)], { type: file.type ?? 'application/octet-stream' }), file.name);
  return rawRequest(who, 'POST', `/api/threads/${threadId}/messages`, form);
}

/** The test client only speaks JSON; attachments need the raw fetch with the same session cookie. */
async function rawRequest(who: Person, method: string, path: string, body?: FormData) {
  const cookie = (who.client as unknown as { cookie: string }).cookie;
  return fetch(app.url + path, { method, headers: { cookie }, body });
}

const PNG_1PX = Uint8Array.from(
  Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==', 'base64'),
);

function digestMails(to: string) {
  return (app.mail?.messages() ?? []).filter((m) => m.to.includes(to) && /unread message/.test(m.subject));
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

beforeAll(async () => {
  app = await startTestApp({ env: { MESSAGE_DIGEST_DELAY_MS: String(DIGEST_DELAY_MS) }, limits: { messages: { windowMs: 60_000, limit: 40 } } });
  songwriter = await person('sw@example.test', ['songwriter'], 'Nell Songwriter');
  otherSongwriter = await person('sw2@example.test', ['songwriter'], 'Ada Other');
  drummer = await person('dr@example.test', ['drummer'], 'Odo Drummer');
  secondDrummer = await person('dr2@example.test', ['drummer'], 'Pia Second');
  engineer = await person('eng@example.test', ['engineer'], 'Ivo Engineer');
  outsider = await person('out@example.test', ['drummer', 'engineer'], 'Uma Outsider');
});
afterAll(async () => {
  await app?.close();
});

describe('opening a conversation about a brief', () => {
  it('gives the songwriter and the named drummer the same thread, created once', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const bySongwriter = await briefThread(songwriter, briefId, drummer.id);
    expect(bySongwriter.status).toBe(200);
    expect(bySongwriter.body.thread).toMatchObject({ kind: 'brief', subject: 'Lantern Song', briefId, bookingId: null, unread: 0 });
    const roles = Object.fromEntries(bySongwriter.body.thread.participants.map((p: { id: string; role: string }) => [p.id, p.role]));
    expect(roles).toEqual({ [songwriter.id]: 'songwriter', [drummer.id]: 'drummer' });

    const byDrummer = await briefThread(drummer, briefId);
    expect(byDrummer.status).toBe(200);
    expect(byDrummer.body.thread.id).toBe(bySongwriter.body.thread.id);
    const again = await briefThread(songwriter, briefId, drummer.id);
    expect(again.body.thread.id).toBe(bySongwriter.body.thread.id);
  });

  it('keeps one thread per drummer on the same brief', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const first = await briefThread(drummer, briefId);
    const second = await briefThread(secondDrummer, briefId);
    expect(first.status).toBe(200);
    expect(second.status).toBe(200);
    expect(second.body.thread.id).not.toBe(first.body.thread.id);
  });

  it('lets a drummer talk about a hired brief', async () => {
    const briefId = insertBrief(songwriter.id, 'hired');
    expect((await briefThread(drummer, briefId)).status).toBe(200);
  });

  it('hides a draft from drummers: 404, no thread', async () => {
    const briefId = insertBrief(songwriter.id, 'draft');
    const res = await briefThread(drummer, briefId);
    expect(res.status).toBe(404);
    expect(res.body.thread).toBeUndefined();
    const owner = await briefThread(songwriter, briefId, drummer.id);
    expect(owner.status).toBe(409);
    expect(owner.body.error.code).toBe('brief_not_open');
  });

  it('refuses a new thread on a withdrawn brief but keeps an existing one reachable', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const existing = await briefThread(drummer, briefId);
    app.db.update(briefs).set({ status: 'withdrawn' }).where(eq(briefs.id, briefId)).run();
    expect((await briefThread(secondDrummer, briefId)).status).toBe(404);
    const reopened = await briefThread(drummer, briefId);
    expect(reopened.status).toBe(200);
    expect(reopened.body.thread.id).toBe(existing.body.thread.id);
  });

  it('does not let a drummer open a thread in another drummer’s name', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const res = await briefThread(drummer, briefId, secondDrummer.id);
    expect(res.status).toBe(404);
    expect(res.body.thread).toBeUndefined();
  });

  it('does not let another songwriter or an engineer open a thread on someone’s brief', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    for (const who of [otherSongwriter, engineer]) {
      const res = await briefThread(who, briefId, drummer.id);
      expect(res.status).toBe(404);
      expect(res.body.thread).toBeUndefined();
    }
  });

  it('asks the songwriter to name a drummer, and only a drummer', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const none = await briefThread(songwriter, briefId);
    expect(none.status).toBe(400);
    expect(none.body.error.fields.drummerId).toBeTruthy();
    expect((await briefThread(songwriter, briefId, engineer.id)).status).toBe(404);
    expect((await briefThread(songwriter, briefId, randomUUID())).status).toBe(404);
  });

  it('answers 404 for an unknown brief and 401 when signed out', async () => {
    expect((await briefThread(drummer, randomUUID())).status).toBe(404);
    expect((await app.client().post(`/api/briefs/${insertBrief(songwriter.id, 'open')}/thread`, {})).status).toBe(401);
  });

  it('refuses unknown fields instead of a 500', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const res = await songwriter.client.post(`/api/briefs/${briefId}/thread`, { drummerId: drummer.id, extra: 1 });
    expect(res.status).toBe(400);
  });
});

describe('booking conversations', () => {
  it('puts songwriter, drummer and engineer in one thread with their roles', async () => {
    const bookingId = insertBooking({ songwriterId: songwriter.id, drummerId: drummer.id, engineerId: engineer.id });
    const res = await engineer.client.post(`/api/bookings/${bookingId}/thread`);
    expect(res.status).toBe(200);
    expect(res.body.thread).toMatchObject({ kind: 'booking', subject: 'Copper Tide', bookingId, briefId: null });
    const roles = Object.fromEntries(res.body.thread.participants.map((p: { id: string; role: string }) => [p.id, p.role]));
    expect(roles).toEqual({ [songwriter.id]: 'songwriter', [drummer.id]: 'drummer', [engineer.id]: 'engineer' });
    const fromSongwriter = await songwriter.client.post(`/api/bookings/${bookingId}/thread`);
    expect(fromSongwriter.body.thread.id).toBe(res.body.thread.id);
  });

  it('answers 404 to anyone outside the booking', async () => {
    const bookingId = insertBooking({ songwriterId: songwriter.id, drummerId: drummer.id });
    for (const who of [secondDrummer, otherSongwriter, engineer, outsider]) {
      const res = await who.client.post(`/api/bookings/${bookingId}/thread`);
      expect(res.status).toBe(404);
      expect(res.body.thread).toBeUndefined();
    }
  });
});

describe('sending and reading messages', () => {
  it('delivers a message to the other side, counts it unread there, and clears it on read', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    const before = (await songwriter.client.get('/api/unread')).body.messages;

    const sent = await send(drummer, threadId, '  Hi! I can do brushes on the verses.  ');
    expect(sent.status).toBe(201);
    expect(sent.body.message).toMatchObject({ threadId, senderId: drummer.id, senderName: 'Odo Drummer', body: 'Hi! I can do brushes on the verses.', attachment: null });

    expect((await songwriter.client.get('/api/unread')).body.messages).toBe(before + 1);
    expect((await drummer.client.get(`/api/threads/${threadId}/messages`)).body.thread.unread).toBe(0);

    const list = await songwriter.client.get(`/api/threads/${threadId}/messages`);
    expect(list.status).toBe(200);
    expect(list.body.messages.map((m: { body: string }) => m.body)).toEqual(['Hi! I can do brushes on the verses.']);
    expect(list.body.thread.unread).toBe(1);

    const read = await songwriter.client.post(`/api/threads/${threadId}/read`);
    expect(read.status).toBe(200);
    expect(read.body.unread).toBe(before);
    expect((await songwriter.client.get('/api/unread')).body.messages).toBe(before);
  });

  it('counts a message sent in the same millisecond as a read as unread: the marker is the newest message seen', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    expect((await send(drummer, threadId, 'First take is up.')).status).toBe(201);
    const before = (await songwriter.client.get('/api/unread')).body.messages;
    // Freeze the clock (Date only, timers run) so the read and the next message carry the same millisecond.
    vi.useFakeTimers({ toFake: ['Date'], now: Date.now() + 5_000 });
    try {
      expect((await songwriter.client.post(`/api/threads/${threadId}/read`)).body.unread).toBe(before - 1);
      expect((await send(drummer, threadId, 'Second take, same millisecond.')).status).toBe(201);
      expect((await songwriter.client.get('/api/unread')).body.messages).toBe(before);
    } finally {
      vi.useRealTimers();
    }
  });

  it('lists my threads newest first with unread counts and the last message', async () => {
    const briefA = insertBrief(songwriter.id, 'open', 'Older Song');
    const briefB = insertBrief(songwriter.id, 'open', 'Newer Song');
    const a = (await briefThread(songwriter, briefA, secondDrummer.id)).body.thread.id;
    const b = (await briefThread(songwriter, briefB, secondDrummer.id)).body.thread.id;
    await send(secondDrummer, a, 'first in A');
    await send(secondDrummer, b, 'only one in B');
    await send(secondDrummer, a, 'second in A, now the newest');

    const res = await songwriter.client.get('/api/threads');
    expect(res.status).toBe(200);
    const mine = res.body.items.filter((t: { id: string }) => t.id === a || t.id === b);
    expect(mine.map((t: { id: string }) => t.id)).toEqual([a, b]);
    expect(mine[0]).toMatchObject({ subject: 'Older Song', unread: 2, lastMessage: { body: 'second in A, now the newest', senderName: 'Pia Second' } });
    expect(mine[1]).toMatchObject({ subject: 'Newer Song', unread: 1 });
    const times = res.body.items.map((t: { lastMessageAt: string | null; createdAt: string }) => Date.parse(t.lastMessageAt ?? t.createdAt));
    expect([...times].sort((x, y) => y - x)).toEqual(times);
  });

  it('returns only messages newer than ?after so polling picks up just the new ones', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    const first = (await send(drummer, threadId, 'one')).body.message;
    await send(songwriter, threadId, 'two');
    await send(drummer, threadId, 'three');
    const res = await songwriter.client.get(`/api/threads/${threadId}/messages?after=${encodeURIComponent(first.createdAt)}`);
    expect(res.status).toBe(200);
    expect(res.body.messages.map((m: { body: string }) => m.body)).toEqual(['two', 'three']);
    const byMillis = await songwriter.client.get(`/api/threads/${threadId}/messages?after=${Date.parse(first.createdAt)}`);
    expect(byMillis.body.messages).toHaveLength(2);
    const created = res.body.messages.map((m: { createdAt: string }) => Date.parse(m.createdAt));
    expect(created[0]).toBeGreaterThan(Date.parse(first.createdAt));
    expect(created[1]).toBeGreaterThan(created[0]);
  });

  it('answers 400, not 500, to a bad ?after and to an empty or oversized body', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    expect((await drummer.client.get(`/api/threads/${threadId}/messages?after=yesterday`)).status).toBe(400);
    const empty = await send(drummer, threadId, '   ');
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.body).toBeTruthy();
    expect((await send(drummer, threadId, 'x'.repeat(5001))).status).toBe(400);
    expect((await drummer.client.post(`/api/threads/${threadId}/messages`, '{"body":', { 'content-type': 'application/json' })).status).toBe(400);
    expect((await drummer.client.post(`/api/threads/${threadId}/messages`, { body: 42 })).status).toBe(400);
  });

  it('lets nobody outside a thread read it, write in it or mark it read (404, never data)', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    await send(drummer, threadId, 'private words');
    for (const who of [secondDrummer, otherSongwriter, engineer, outsider]) {
      const read = await who.client.get(`/api/threads/${threadId}/messages`);
      expect(read.status).toBe(404);
      expect(JSON.stringify(read.body)).not.toContain('private words');
      expect((await send(who, threadId, 'let me in')).status).toBe(404);
      expect((await who.client.post(`/api/threads/${threadId}/read`)).status).toBe(404);
      const list = await who.client.get('/api/threads');
      expect(list.body.items.map((t: { id: string }) => t.id)).not.toContain(threadId);
    }
    expect((await app.client().get(`/api/threads/${threadId}/messages`)).status).toBe(401);
    const messages = (await drummer.client.get(`/api/threads/${threadId}/messages`)).body.messages;
    expect(messages.map((m: { body: string }) => m.body)).toEqual(['private words']);
  });

  it('asks an unverified account to confirm its email before it writes', async () => {
    const { client, user } = await signUp(app, { email: 'unverified@example.test', roles: ['drummer'], verify: false });
    const briefId = insertBrief(songwriter.id, 'open');
    const threadId = (await client.post(`/api/briefs/${briefId}/thread`, {})).body.thread.id;
    expect(threadId).toBeTruthy();
    const res = await client.post(`/api/threads/${threadId}/messages`, { body: 'hello' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('email_unverified');
    expect(user.id).toBeTruthy();
  });
});

describe('attachments', () => {
  it('stores a small PNG and serves it only to participants, as a download with nosniff', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    const res = await sendFile(drummer, threadId, { bytes: PNG_1PX, name: 'kit "setup".png', type: 'image/png' }, 'My kit layout');
    expect(res.status).toBe(201);
    const { message } = await res.json();
    expect(message.attachment).toMatchObject({ name: 'kit "setup".png', mime: 'image/png', size: PNG_1PX.length, url: `/api/messages/${message.id}/attachment` });

    const download = await rawRequest(songwriter, 'GET', message.attachment.url);
    expect(download.status).toBe(200);
    expect(download.headers.get('content-type')).toBe('image/png');
    expect(download.headers.get('x-content-type-options')).toBe('nosniff');
    expect(download.headers.get('content-disposition')).toMatch(/^attachment; filename="kit _setup_.png"/);
    expect(new Uint8Array(await download.arrayBuffer())).toEqual(PNG_1PX);

    for (const who of [secondDrummer, otherSongwriter, outsider]) {
      const denied = await rawRequest(who, 'GET', message.attachment.url);
      expect(denied.status).toBe(404);
      expect(denied.headers.get('content-type')).toMatch(/json/);
    }
    expect((await fetch(app.url + message.attachment.url)).status).toBe(401);
  });

  it('takes a plain-text file with an empty message', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const threadId = (await briefThread(songwriter, briefId, drummer.id)).body.thread.id;
    const res = await sendFile(songwriter, threadId, { bytes: new TextEncoder().encode('Verse 1: half-time feel\nChorus: open hats\n'), name: 'notes.txt' });
    expect(res.status).toBe(201);
    expect((await res.json()).message).toMatchObject({ body: '', attachment: { mime: 'text/plain', name: 'notes.txt' } });
  });

  it('refuses a file whose content is not an accepted type, whatever its name, and keeps nothing', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    const zip = Uint8Array.from([0x50, 0x4b, 0x03, 0x04, ...new Array(200).fill(0x01)]);
    const res = await sendFile(drummer, threadId, { bytes: zip, name: 'photo.png', type: 'image/png' }, 'see attached');
    expect(res.status).toBe(415);
    expect((await res.json()).error.message).toMatch(/checked by its content/);
    const messages = (await drummer.client.get(`/api/threads/${threadId}/messages`)).body.messages;
    expect(messages).toHaveLength(0);
  });

  it('answers 413 to an attachment over 5 MB and leaves no file behind', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    const big = new Uint8Array(5 * 1024 * 1024 + 10).fill(0x61);
    const res = await sendFile(drummer, threadId, { bytes: big, name: 'huge.txt' });
    expect(res.status).toBe(413);
    const dir = join(app.dataDir, 'files', 'messages');
    const stored = existsSync(dir) ? readdirSync(dir) : [];
    expect(stored.some((f) => f.endsWith('.part'))).toBe(false);
    expect((await drummer.client.get(`/api/threads/${threadId}/messages`)).body.messages).toHaveLength(0);
  });

  it('refuses an upload from someone outside the thread before storing anything', async () => {
    const briefId = insertBrief(songwriter.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    const dir = join(app.dataDir, 'files', 'messages');
    const before = existsSync(dir) ? readdirSync(dir).length : 0;
    const res = await sendFile(outsider, threadId, { bytes: PNG_1PX, name: 'x.png' }, 'hi');
    expect(res.status).toBe(404);
    expect(existsSync(dir) ? readdirSync(dir).length : 0).toBe(before);
  });
});

describe('the digest mail', () => {
  it('mails one digest for several unread messages, with links into the app', async () => {
    const recipient = await person('digest-sw@example.test', ['songwriter'], 'Dee Digest');
    const briefId = insertBrief(recipient.id, 'open', 'Marigold Run');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    await send(drummer, threadId, 'First thought about the groove');
    await send(drummer, threadId, 'Second: I would ride the crash in the last chorus');
    await send(drummer, threadId, 'Third: demo of the fill is coming');

    const mail = await app.waitForMail(recipient.email, /unread message/);
    expect(mail.subject).toBe('3 unread messages on Kitlane');
    expect(mail.text).toContain('Marigold Run');
    expect(mail.text).toContain('Odo Drummer: “Third: demo of the fill is coming”');
    expect(mail.links).toContain(`http://kitlane.test/messages/${threadId}`);
    expect(mail.links).toContain('http://kitlane.test/notifications/settings?mute=message_digest');
    await sleep(DIGEST_DELAY_MS * 2);
    expect(digestMails(recipient.email)).toHaveLength(1);
  });

  it('mails nothing when the message is read within the delay', async () => {
    const recipient = await person('reader@example.test', ['songwriter'], 'Quick Reader');
    const briefId = insertBrief(recipient.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    await send(drummer, threadId, 'Are you around?');
    await recipient.client.post(`/api/threads/${threadId}/read`);
    await sleep(DIGEST_DELAY_MS * 2.5);
    await app.kitlane.ctx.jobs.drain();
    expect(digestMails(recipient.email)).toHaveLength(0);
  });

  it('never mails the same message twice, and a later message gets its own digest', async () => {
    const recipient = await person('twice@example.test', ['songwriter'], 'Tess Twice');
    const briefId = insertBrief(recipient.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    await send(drummer, threadId, 'message one');
    await app.waitForMail(recipient.email, /1 unread message/);
    await send(drummer, threadId, 'message two');
    await sleep(DIGEST_DELAY_MS * 2.5);
    const mails = digestMails(recipient.email);
    expect(mails).toHaveLength(2);
    const newest = mails[0]!;
    expect(newest.text).toContain('message two');
    expect(newest.text).not.toContain('message one');
  });

  it('respects the message_digest mute', async () => {
    const recipient = await person('muted@example.test', ['songwriter'], 'Mo Muted');
    app.db.insert(notificationMutes).values({ userId: recipient.id, kind: 'message_digest' }).run();
    const briefId = insertBrief(recipient.id, 'open');
    const threadId = (await briefThread(drummer, briefId)).body.thread.id;
    await send(drummer, threadId, 'you will not get mail about this');
    await sleep(DIGEST_DELAY_MS * 2.5);
    expect(digestMails(recipient.email)).toHaveLength(0);
    expect((await recipient.client.get('/api/unread')).body.messages).toBe(1);
  });
});

describe('rate limit', () => {
  it('answers 429 with our error shape once an account sends too many messages', async () => {
    const limited = await startTestApp({ limits: { messages: { windowMs: 60_000, limit: 3 } } });
    try {
      const sw = await signUp(limited, { email: 'rl-sw@example.test', roles: ['songwriter'] });
      const dr = await signUp(limited, { email: 'rl-dr@example.test', roles: ['drummer'] });
      const briefId = randomUUID();
      const now = new Date();
      limited.db
        .insert(briefs)
        .values({ id: briefId, songwriterId: sw.user.id, status: 'open', songTitle: 'Limit', tempoBpm: 90, budgetMinMinor: 1, budgetMaxMinor: 2, currency: 'USD', deadline: '2031-01-01', createdAt: now, updatedAt: now })
        .run();
      const threadId = (await dr.client.post(`/api/briefs/${briefId}/thread`, {})).body.thread.id;
      const statuses: number[] = [];
      for (let i = 0; i < 4; i++) statuses.push((await dr.client.post(`/api/threads/${threadId}/messages`, { body: `m${i}` })).status);
      expect(statuses).toEqual([201, 201, 201, 429]);
      const last = await dr.client.post(`/api/threads/${threadId}/messages`, { body: 'again' });
      expect(last.body.error.code).toBe('rate_limited');
      // The budget is per account: the songwriter can still answer.
      expect((await sw.client.post(`/api/threads/${threadId}/messages`, { body: 'still here' })).status).toBe(201);
    } finally {
      await limited.close();
    }
  });
});

describe('demo seed step', () => {
  it('skips quietly without briefs, then writes conversations on published briefs through the service', async () => {
    const fresh = await startTestApp();
    try {
      const sw = await signUp(fresh, { email: 'seed-sw@example.test', roles: ['songwriter'] });
      const dr = await signUp(fresh, { email: 'seed-dr@example.test', roles: ['drummer'] });
      const state = { userIds: { juno: dr.user.id } };
      await messagesSeedStep.run(fresh.kitlane.ctx, state);
      expect(state).toMatchObject({ messageThreads: 0, messages: 0 });

      const now = new Date();
      for (const [i, status] of (['open', 'draft', 'hired'] as const).entries()) {
        fresh.db
          .insert(briefs)
          .values({ id: randomUUID(), songwriterId: sw.user.id, status, songTitle: `Seed ${i}`, tempoBpm: 90, budgetMinMinor: 1, budgetMaxMinor: 2, currency: 'USD', deadline: '2031-01-01', createdAt: now, updatedAt: now, publishedAt: now })
          .run();
      }
      await messagesSeedStep.run(fresh.kitlane.ctx, state);
      expect(state).toMatchObject({ messageThreads: 2 });
      const threads = (await sw.client.get('/api/threads')).body.items as { subject: string; unread: number }[];
      expect(threads.map((t) => t.subject).sort()).toEqual(['Seed 0', 'Seed 2']);
      expect(threads.every((t) => t.unread >= 1)).toBe(true);
      // History, not news: no digest is even scheduled for seeded messages.
      expect(fresh.db.select().from(jobs).where(eq(jobs.kind, DIGEST_JOB)).all()).toHaveLength(0);
    } finally {
      await fresh.close();
    }
  });
});
