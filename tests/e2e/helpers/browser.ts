// Debian's Chromium through playwright-core (never `playwright install`). Each test gets a fresh context,
// and every page fails its test on a console error or an uncaught page error unless the test said it
// expects that exact message (e.g. the 401 of a wrong password, which Chromium logs as a resource error).
import { mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export const SCREENSHOT_DIR = resolve('.artifacts/screenshots');

export const VIEWPORTS = {
  desktop: { width: 1280, height: 800 },
  mobile: { width: 390, height: 844 },
} as const;
export type ViewportName = keyof typeof VIEWPORTS;

export function launchChromium(): Promise<Browser> {
  return chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
}

export type PageProblems = {
  /** Lets one console error through when its text matches; each call allows one occurrence. */
  expectConsoleError(pattern: RegExp): void;
  /** Ignores every console error matching this (noise from pages that are not Kitlane's, such as a fake's). */
  ignoreConsoleError(pattern: RegExp): void;
  /** Throws when an unexpected error was seen, or an expected one never came. */
  assertClean(): void;
};

export function watchProblems(page: Page): PageProblems {
  const unexpected: string[] = [];
  const expected: RegExp[] = [];
  const ignored: RegExp[] = [];
  page.on('console', (message) => {
    if (message.type() !== 'error') return;
    const text = `${message.text()} (${message.location().url})`;
    if (ignored.some((pattern) => pattern.test(text))) return;
    const at = expected.findIndex((pattern) => pattern.test(text));
    if (at >= 0) expected.splice(at, 1);
    else unexpected.push(`console.error: ${text}`);
  });
  page.on('pageerror', (error) => unexpected.push(`page error: ${error.message}`));
  return {
    expectConsoleError: (pattern) => expected.push(pattern),
    ignoreConsoleError: (pattern) => ignored.push(pattern),
    assertClean() {
      if (unexpected.length) throw new Error(`The page reported errors:\n${unexpected.join('\n')}`);
      if (expected.length) throw new Error(`Expected console errors did not happen: ${expected.join(', ')}`);
    },
  };
}

export type BrowserSession = {
  context: BrowserContext;
  page: Page;
  problems: PageProblems;
  close(): Promise<void>;
};

/** A fresh context (own cookies and storage) with one watched page in the given viewport. */
export async function openSession(browser: Browser, viewport: ViewportName = 'desktop'): Promise<BrowserSession> {
  const context = await browser.newContext({ viewport: VIEWPORTS[viewport], locale: 'en-GB', timezoneId: 'UTC' });
  const page = await context.newPage();
  const problems = watchProblems(page);
  return { context, page, problems, close: () => context.close() };
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
