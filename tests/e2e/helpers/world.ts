// One browser spec's world: the real server and Chromium, started once per file, and a fresh watched
// session per person in a test. Every session a test opened must end free of unexpected console and page
// errors; the check runs after each test, so a spec states only its story.
import { afterAll, afterEach, beforeAll, expect } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { briefBody } from '../../api/helpers/hire';
import { launchChromium, openSession, type BrowserSession, type ViewportName } from './browser';
import { startTestServer, type TestServer } from './server';

/** The seed gives every demo account this password (README: demo logins). */
export const DEMO_PASSWORD = process.env.DEMO_PASSWORD ?? 'kitlane-demo-pass';

export type E2eWorldOptions = {
  /** Environment the server boots with (e.g. a short digest delay); restored after the file. */
  env?: Record<string, string>;
};

export type E2eWorld = {
  readonly server: TestServer;
  readonly browser: Browser;
  /** The address of a path on the test server, e.g. `url('/messages')`. */
  url(path: string): string;
  /** A fresh context (own cookies) with one watched page, closed and checked after the test. */
  session(viewport?: ViewportName): Promise<BrowserSession>;
  /** Signs in through the API with the page's own cookie jar (the sign-in form has its own tests). */
  signIn(page: Page, email: string): Promise<void>;
  /** A new session signed in through the sign-in form, as a person does it. */
  signedIn(email: string, viewport?: ViewportName): Promise<BrowserSession>;
  /** Creates and publishes a brief as the page's signed-in songwriter; returns its id. */
  publishBrief(page: Page, overrides?: Record<string, unknown>): Promise<string>;
  /** Opens a booking from the bookings list by its song title. */
  openBooking(page: Page, songTitle: string): Promise<void>;
};

/** Polls until the value matches; the default second of expect.poll is too short on a busy test machine. */
export function eventually<T>(read: () => Promise<T> | T, timeout = 15_000, interval = 200) {
  return expect.poll(read, { timeout, interval });
}

export const h1 = (page: Page) => page.getByRole('heading', { level: 1 }).innerText();

function setEnv(values: Record<string, string>): () => void {
  const previous = Object.fromEntries(Object.keys(values).map((key) => [key, process.env[key]]));
  Object.assign(process.env, values);
  return () => {
    for (const [key, value] of Object.entries(previous)) {
      if (value === undefined) delete process.env[key];
      else process.env[key] = value;
    }
  };
}

async function closeCheckingProblems(sessions: BrowserSession[]): Promise<void> {
  try {
    for (const s of sessions) s.problems.assertClean();
  } finally {
    await Promise.all(sessions.map((s) => s.close()));
  }
}

/** Call once at the top of a spec file: it registers the hooks that start, check and stop the world. */
export function useE2eWorld(options: E2eWorldOptions = {}): E2eWorld {
  let server: TestServer | undefined;
  let browser: Browser | undefined;
  let restoreEnv = () => {};
  const open: BrowserSession[] = [];

  beforeAll(async () => {
    restoreEnv = setEnv(options.env ?? {});
    server = await startTestServer();
    browser = await launchChromium();
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
    restoreEnv();
  });

  afterEach(() => closeCheckingProblems(open.splice(0)));

  const started = <T>(value: T | undefined, what: string): T => {
    if (!value) throw new Error(`The e2e ${what} is not running: use the world inside a test`);
    return value;
  };

  const world: E2eWorld = {
    get server() {
      return started(server, 'server');
    },
    get browser() {
      return started(browser, 'browser');
    },
    url: (path) => `${world.server.url}${path}`,
    async session(viewport = 'desktop') {
      const s = await openSession(world.browser, viewport);
      open.push(s);
      return s;
    },
    async signIn(page, email) {
      const res = await page.request.post(world.url('/api/auth/login'), { data: { email, password: DEMO_PASSWORD } });
      expect(res.status()).toBe(200);
    },
    async signedIn(email, viewport = 'desktop') {
      const s = await world.session(viewport);
      await s.page.goto(world.url('/sign-in'));
      await s.page.getByLabel('Email').fill(email);
      await s.page.getByLabel('Password').fill(DEMO_PASSWORD);
      await s.page.getByRole('button', { name: 'Sign in' }).click();
      await s.page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
      return s;
    },
    async publishBrief(page, overrides = {}) {
      const created = await page.request.post(world.url('/api/briefs'), { data: briefBody(overrides) });
      expect(created.status()).toBe(201);
      const { brief } = (await created.json()) as { brief: { id: string } };
      expect((await page.request.post(world.url(`/api/briefs/${brief.id}/publish`))).status()).toBe(200);
      return brief.id;
    },
    async openBooking(page, songTitle) {
      await page.goto(world.url('/bookings'));
      await page.getByRole('link', { name: songTitle }).first().click();
      await page.waitForURL(/\/bookings\/[^/?]+$/);
    },
  };
  return world;
}
