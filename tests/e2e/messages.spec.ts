// Issue 3, messages part: a songwriter and a drummer write to each other in two browser contexts; new
// messages and the unread badge appear without a reload; the digest mail reaches the catcher and its link
// opens the conversation; the messages, bell and settings pages pass an axe check.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchChromium, openSession, screenshot, type BrowserSession, type ViewportName } from './helpers/browser';
import { startTestServer, type TestServer } from './helpers/server';
import { seriousAxeViolations } from './helpers/a11y';
import { briefBody } from '../api/helpers/hire';

// Short, so the digest arrives within the test; production waits 10 minutes (MESSAGE_DIGEST_DELAY_MS).
const DIGEST_DELAY_MS = 4_000;
const DEMO_PASSWORD = process.env.DEMO_PASSWORD ?? 'kitlane-demo-pass';
const SONGWRITER = 'mara@kitlane.test';
const DRUMMER = 'juno@kitlane.test';

let server: TestServer;
let browser: Browser;
const sessions: BrowserSession[] = [];
let previousDelay: string | undefined;

beforeAll(async () => {
  previousDelay = process.env.MESSAGE_DIGEST_DELAY_MS;
  process.env.MESSAGE_DIGEST_DELAY_MS = String(DIGEST_DELAY_MS);
  server = await startTestServer();
  browser = await launchChromium();
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
  if (previousDelay === undefined) delete process.env.MESSAGE_DIGEST_DELAY_MS;
  else process.env.MESSAGE_DIGEST_DELAY_MS = previousDelay;
});

afterEach(async () => {
  const open = sessions.splice(0);
  try {
    for (const s of open) s.problems.assertClean();
  } finally {
    await Promise.all(open.map((s) => s.close()));
  }
});

async function session(viewport: ViewportName = 'desktop'): Promise<BrowserSession> {
  const s = await openSession(browser, viewport);
  sessions.push(s);
  return s;
}

/** Polls until the value matches; the header polls every 10 s, so allow a little more than that. */
function eventually<T>(read: () => Promise<T> | T, timeout = 15_000) {
  return expect.poll(read, { timeout, interval: 200 });
}

/** Signs in through the API with the context's own cookie jar (the sign-in form has its own test). */
async function signIn(page: Page, email: string): Promise<void> {
  const res = await page.request.post(`${server.url}/api/auth/login`, { data: { email, password: DEMO_PASSWORD } });
  expect(res.status()).toBe(200);
}

async function publishedBrief(page: Page, songTitle: string): Promise<string> {
  const created = await page.request.post(`${server.url}/api/briefs`, { data: briefBody({ songTitle }) });
  expect(created.status()).toBe(201);
  const { brief } = (await created.json()) as { brief: { id: string } };
  const published = await page.request.post(`${server.url}/api/briefs/${brief.id}/publish`);
  expect(published.status()).toBe(200);
  return brief.id;
}

/** The number in the header's "Messages, N unread" link (0 when it just says "Messages"). */
async function unreadBadge(page: Page): Promise<number> {
  const name = (await page.getByTestId('header-messages').innerText()).trim();
  const match = /Messages, (\d+) unread/.exec(name);
  return match ? Number(match[1]) : 0;
}

function digestsTo(to: string) {
  return server.mail.messages().filter((m) => m.to.includes(to) && /unread message/.test(m.subject));
}

async function expectAxeClean(page: Page, name: string): Promise<void> {
  expect(await seriousAxeViolations(page), `axe on ${name}`).toEqual([]);
}

async function messageBodies(page: Page): Promise<string[]> {
  return (await page.getByRole('log', { name: 'Conversation' }).locator('li article p.whitespace-pre-wrap').allInnerTexts()).map((t) => t.trim());
}

describe('messages between a songwriter and a drummer', () => {
  it('shows new messages and the unread badge without a reload, and mails one digest with a working link', async () => {
    const songwriter = await session('desktop');
    const drummer = await session('desktop');
    await signIn(songwriter.page, SONGWRITER);
    await signIn(drummer.page, DRUMMER);
    const title = `Night Ferry ${Date.now()}`;
    const briefId = await publishedBrief(songwriter.page, title);

    // The drummer opens the conversation about the open brief (get-or-create) and goes to it.
    const opened = await drummer.page.request.post(`${server.url}/api/briefs/${briefId}/thread`, { data: {} });
    expect(opened.status()).toBe(200);
    const threadId = ((await opened.json()) as { thread: { id: string } }).thread.id;

    await songwriter.page.goto(`${server.url}/messages`);
    await eventually(() => songwriter.page.getByRole('heading', { level: 1 }).innerText()).toBe('Messages');
    await eventually(() => songwriter.page.getByTestId('header-messages').count()).toBe(1);
    const before = await unreadBadge(songwriter.page);

    await drummer.page.goto(`${server.url}/messages/${threadId}`);
    await eventually(() => drummer.page.getByRole('heading', { level: 1 }).innerText()).toBe(title);
    await eventually(() => drummer.page.getByText('No messages yet').count()).toBe(1);
    await expectAxeClean(drummer.page, 'an empty conversation');
    await drummer.page.getByLabel('Your message').fill('Hello! I can play this with a light touch on the verses. Brushes or sticks?');
    await drummer.page.getByRole('button', { name: 'Send' }).click();
    await eventually(() => messageBodies(drummer.page)).toEqual(['Hello! I can play this with a light touch on the verses. Brushes or sticks?']);
    await eventually(() => drummer.page.getByLabel('Your message').inputValue()).toBe('');

    // The songwriter's page was never reloaded: the header count and the list update by polling.
    await eventually(() => unreadBadge(songwriter.page)).toBe(before + 1);
    const row = songwriter.page.getByRole('link', { name: new RegExp(title) });
    // The list polls on its own clock: it may first show the thread from before the message arrived.
    await eventually(async () => ((await row.count()) === 1 ? row.innerText() : '')).toMatch(/\b1\s+unread/);
    await screenshot(songwriter.page, 'messages-list-desktop');
    await expectAxeClean(songwriter.page, 'the messages list');

    await row.click();
    await eventually(() => messageBodies(songwriter.page)).toEqual(['Hello! I can play this with a light touch on the verses. Brushes or sticks?']);
    // Opening the thread reads it: the badge drops at once.
    await eventually(() => unreadBadge(songwriter.page)).toBe(before);

    await songwriter.page.getByLabel('Your message').fill('Sticks, but keep the hats soft until the second chorus.');
    await songwriter.page.getByRole('button', { name: 'Send' }).click();
    // The drummer sees the reply in the open thread (it polls every 3 s).
    await eventually(() => messageBodies(drummer.page)).toEqual([
      'Hello! I can play this with a light touch on the verses. Brushes or sticks?',
      'Sticks, but keep the hats soft until the second chorus.',
    ]);
    await screenshot(drummer.page, 'messages-thread-desktop');
    await expectAxeClean(drummer.page, 'a conversation');

    // The songwriter leaves; the drummer writes again; nobody reads it for the digest delay → one mail.
    await songwriter.page.goto(`${server.url}/notifications`);
    const earlierDigests = new Set(digestsTo(SONGWRITER).map((m) => m.id));
    await drummer.page.getByLabel('Your message').fill('One more thing: do you want a count-in on the stems?');
    await drummer.page.getByRole('button', { name: 'Send' }).click();
    // The first message may already have brought a digest (it waited unread); this one must bring its own.
    await eventually(() => digestsTo(SONGWRITER).filter((m) => !earlierDigests.has(m.id)).length, DIGEST_DELAY_MS + 15_000).toBe(1);
    const mail = digestsTo(SONGWRITER).find((m) => !earlierDigests.has(m.id))!;
    expect(mail.subject).toBe('1 unread message on Kitlane');
    expect(mail.text).toContain('One more thing: do you want a count-in on the stems?');
    const threadLink = mail.links.find((l) => l.endsWith(`/messages/${threadId}`));
    expect(threadLink).toBeTruthy();
    expect(mail.links.some((l) => l.includes('/notifications/settings?mute=message_digest'))).toBe(true);

    await songwriter.page.goto(threadLink!);
    await eventually(() => messageBodies(songwriter.page)).toContain('One more thing: do you want a count-in on the stems?');
  });

  it('the bell, the notifications page and the mail settings pass axe, and the mail footer link stops a kind', async () => {
    const { page } = await session('desktop');
    await signIn(page, SONGWRITER);
    await page.goto(`${server.url}/notifications`);
    await eventually(() => page.getByRole('heading', { level: 1 }).innerText()).toBe('Notifications');
    await eventually(() => page.getByText(/Loading notifications/).count()).toBe(0);
    await expectAxeClean(page, 'the notifications page');
    await screenshot(page, 'notifications-desktop');

    await page.getByRole('button', { name: /^Notifications/ }).click();
    await eventually(() => page.getByRole('link', { name: 'Mail settings' }).count()).toBeGreaterThan(0);
    await eventually(() => page.getByText('Loading notifications').count()).toBe(0);
    await expectAxeClean(page, 'the bell panel');
    await screenshot(page, 'notifications-bell-desktop');
    await page.keyboard.press('Escape');

    await page.goto(`${server.url}/notifications/settings?mute=quote_received`);
    await eventually(() => page.getByRole('button', { name: 'Stop these mails' }).count()).toBe(1);
    await expectAxeClean(page, 'the mail settings');
    await page.getByRole('button', { name: 'Stop these mails' }).click();
    await eventually(() => page.getByText(/You no longer get mails about new quotes on my briefs/).count()).toBe(1);
    expect(await page.getByRole('checkbox', { name: 'New quotes on my briefs' }).isChecked()).toBe(false);
    await screenshot(page, 'notification-settings-desktop');
  });

  it('shows the conversation on a phone-sized screen', async () => {
    const { page } = await session('mobile');
    await signIn(page, DRUMMER);
    await page.goto(`${server.url}/messages`);
    await eventually(() => page.getByRole('heading', { level: 1 }).innerText()).toBe('Messages');
    const first = page.getByRole('main').getByRole('link').first();
    await eventually(() => first.count()).toBe(1);
    await first.click();
    await eventually(() => page.getByLabel('Your message').count()).toBe(1);
    await expectAxeClean(page, 'a conversation on a phone');
    await screenshot(page, 'messages-thread-mobile');
  });
});
