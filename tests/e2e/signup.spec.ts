// Issue 2, browser part: a new person signs up in Chromium, confirms the address from the mail catcher,
// sees the navigation of their roles, signs out and in again; the public pages pass an axe check.
import { describe, expect, it } from 'vitest';
import { gzipSync } from 'node:zlib';
import type { Page } from 'playwright-core';
import { screenshot } from './helpers/browser';
import { expectAxeClean } from './helpers/a11y';
import { DEMO_PASSWORD, eventually as eventuallyWithin, useE2eWorld } from './helpers/world';

const world = useE2eWorld();
const { session } = world;

/** These pages answer quickly: poll more often, and give up sooner than the flows with uploads and mail. */
const eventually = <T>(read: () => Promise<T> | T) => eventuallyWithin(read, 10_000, 100);

function mainNav(page: Page) {
  return page.getByRole('navigation', { name: 'Main' });
}

async function navLabels(page: Page): Promise<string[]> {
  return (await mainNav(page).getByRole('link').allInnerTexts()).map((t) => t.trim());
}

async function openAccountMenu(page: Page) {
  await page.getByRole('button', { name: /account menu/ }).click();
}

describe('signing up in the browser', () => {
  it('signs up as drummer and engineer, confirms the email from the mail catcher, and signs out and in again', async () => {
    const { page, problems } = await session('desktop');
    const email = `new-drummer-${Date.now()}@kitlane.test`;
    const password = 'brush-swell-ghost-notes';

    await page.goto(world.url('/sign-up'));
    await eventually(() => page.getByRole('heading', { level: 1 }).innerText()).toBe('Join Kitlane');

    // The client-side check speaks first, beside each field, without asking the server.
    await page.getByRole('button', { name: 'Create account' }).click();
    await eventually(() => page.getByText('Enter a valid email address').count()).toBe(1);
    expect(await page.getByText('Pick at least one role').count()).toBe(1);
    await screenshot(page, 'sign-up-errors-desktop');

    await page.getByLabel('Email').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByLabel('Display name').fill('Rim Shot Rosa');
    await page.getByRole('checkbox', { name: /Drummer/ }).check();
    await page.getByRole('checkbox', { name: /Engineer/ }).check();
    await page.getByRole('button', { name: 'Create account' }).click();

    await page.waitForURL('**/sign-up/check-inbox');
    await eventually(() => page.getByText(email).count()).toBeGreaterThan(0);
    expect(await page.getByRole('button', { name: 'Send the link again' }).count()).toBe(1);
    await screenshot(page, 'check-inbox-desktop');

    // Open the mail in the catcher's web view and follow the link in it, as a person would.
    const mail = await world.server.waitForMail(email, /Confirm your email/);
    const verifyLink = mail.links.find((link) => link.startsWith(world.url('/verify-email?token=')));
    expect(verifyLink, 'the mail links to this server').toBeTruthy();
    // The catcher's own pages have no icon, so Chromium's automatic /favicon.ico request there gets a 404.
    problems.ignoreConsoleError(new RegExp(`404.*\\(${world.server.mailWebUrl.replace(/[.]/g, '\\.')}/favicon\\.ico\\)`));
    await page.goto(world.server.mailWebUrl);
    await page.getByRole('link', { name: 'Confirm your email for Kitlane' }).first().click();
    await page.getByRole('link', { name: verifyLink! }).first().click();

    await page.waitForURL('**/verify-email?token=*');
    await eventually(() => page.getByText('Your email is confirmed').count()).toBe(1);
    await screenshot(page, 'verify-email-desktop');
    // It goes on by itself, signed in.
    await page.waitForURL(world.url('/'), { timeout: 10_000 });

    await eventually(() => navLabels(page)).toEqual(['Open briefs', 'My profile', 'My quotes', 'My rooms', 'Messages', 'Bookings']);
    expect(await page.getByRole('button', { name: /Rim Shot Rosa.*account menu/ }).count()).toBe(1);
    // The bell sits in the header (a link while it was a placeholder, a menu button since notifications landed).
    const banner = page.getByRole('banner');
    const bell = banner.getByRole('button', { name: /^Notifications/ }).or(banner.getByRole('link', { name: /^Notifications/ }));
    expect(await bell.count()).toBe(1);
    await screenshot(page, 'home-signed-in-desktop');

    await page.goto(world.url('/account'));
    await eventually(() => page.getByText('Confirmed', { exact: true }).count()).toBe(1);
    expect(await page.getByRole('checkbox', { name: /Drummer/ }).isChecked()).toBe(true);
    expect(await page.getByRole('checkbox', { name: /Songwriter/ }).isChecked()).toBe(false);
    await screenshot(page, 'account-desktop');
    // The signed-in shell and the account forms are checked too, not only the public pages.
    await expectAxeClean(page, 'the account page');

    await openAccountMenu(page);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await eventually(() => navLabels(page)).toEqual(['Find drummers', 'Rooms']);
    expect(await page.getByRole('link', { name: 'Sign in' }).count()).toBe(1);

    // A wrong password gets the one generic answer (Chromium logs the 401 as a resource error).
    await page.getByRole('link', { name: 'Sign in' }).click();
    await page.getByLabel('Email').fill(email);
    await page.getByLabel('Password').fill('not-the-right-password');
    problems.expectConsoleError(/status of 401/);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await eventually(() => page.getByRole('alert').innerText()).toContain('That email and password do not match an account');
    await screenshot(page, 'sign-in-wrong-password-desktop');

    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(world.url('/'));
    await eventually(() => navLabels(page)).toContain('My rooms');
    expect(await navLabels(page)).not.toContain('My briefs');
    expect(await navLabels(page)).not.toContain('Admin desk');
  });

  it('lets keyboard users skip to the content and shows where focus is', async () => {
    const { page } = await session('desktop');
    await page.goto(world.url('/sign-in'));
    await eventually(() => page.getByRole('heading', { level: 1 }).innerText()).toBe('Sign in');
    await page.keyboard.press('Tab');
    const skip = page.getByRole('link', { name: 'Skip to content' });
    expect(await skip.evaluate((el) => el === document.activeElement)).toBe(true);
    await page.keyboard.press('Tab');
    // The next stop is the home link in the header, drawn with the amber ring.
    const ring = await page.evaluate(() => getComputedStyle(document.activeElement!).outlineColor);
    expect(ring).toBe('rgb(248, 207, 106)');
    await screenshot(page, 'focus-ring-desktop');
  });

  it('shows the navigation behind the menu button on a phone-sized screen', async () => {
    const { page } = await session('mobile');
    await page.goto(world.url('/'));
    await eventually(() => page.getByRole('heading', { level: 1 }).count()).toBe(1);
    // Collapsed: no main navigation until the menu is opened.
    expect(await mainNav(page).count()).toBe(0);
    await screenshot(page, 'home-mobile');

    const menu = page.getByRole('button', { name: 'Menu' });
    await menu.click();
    expect(await menu.getAttribute('aria-expanded')).toBe('true');
    expect(await navLabels(page)).toEqual(['Find drummers', 'Rooms']);
    await screenshot(page, 'menu-open-mobile');

    await mainNav(page).getByRole('link', { name: 'Rooms' }).click();
    await page.waitForURL('**/rooms');
    await eventually(() => page.getByRole('heading', { level: 1 }).innerText()).toBe('Rooms');
    // Following a link closed the menu.
    expect(await mainNav(page).count()).toBe(0);
  });

  it('signs a seeded songwriter in on a phone and shows the songwriter navigation', async () => {
    const { page } = await session('mobile');
    await page.goto(world.url('/sign-in'));
    await screenshot(page, 'sign-in-mobile');
    // A songwriter from the demo seed (the README lists the logins).
    const { DEMO_PEOPLE } = await import('../../server/db/demo-world');
    const songwriter = DEMO_PEOPLE.find((p) => p.roles.includes('songwriter' as never) && p.roles.length === 1)!;
    await page.getByLabel('Email').fill(songwriter.email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(world.url('/'));
    await page.getByRole('button', { name: 'Menu' }).click();
    await eventually(() => navLabels(page)).toEqual(['My briefs', 'Find drummers', 'Messages', 'Bookings', 'Account']);
    await screenshot(page, 'menu-signed-in-mobile');
  });
});

describe('account upkeep in the browser', () => {
  it('resets a forgotten password through the mailed link and signs in with the new one', async () => {
    const { page, problems } = await session('desktop');
    const email = 'juno@kitlane.test';
    const newPassword = 'paradiddle-on-the-ride';
    await page.goto(world.url('/sign-in'));
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    // The page is lazy-loaded: wait for it, or the click lands on the sign-in form still on screen.
    await eventually(() => page.getByRole('heading', { level: 1 }).innerText()).toBe('Forgot your password?');
    await page.getByLabel('Email').fill(email);
    await page.getByRole('button', { name: 'Send me a reset link' }).click();
    await eventually(() => page.getByRole('status').filter({ hasText: 'If an account uses that address' }).count()).toBe(1);
    await screenshot(page, 'forgot-password-sent-desktop');

    const mail = await world.server.waitForMail(email, /Reset your Kitlane password/);
    const link = mail.links.find((l) => l.startsWith(world.url('/reset-password?token=')));
    expect(link, 'the reset mail links to this server').toBeTruthy();
    await page.goto(link!);
    await page.getByLabel('New password').fill(newPassword);
    await page.getByRole('button', { name: 'Save new password' }).click();
    await eventually(() => page.getByText('Your password is changed').count()).toBe(1);

    // The same link cannot be used twice.
    await page.goto(link!);
    await page.getByLabel('New password').fill('another-fresh-password');
    problems.expectConsoleError(/status of 400/);
    await page.getByRole('button', { name: 'Save new password' }).click();
    await eventually(() => page.getByRole('alert').innerText()).toMatch(/not valid any more/);

    await page.goto(world.url('/sign-in'));
    await page.getByLabel('Email').fill(email);
    await page.getByLabel('Password').fill(newPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(world.url('/'));
    await eventually(() => navLabels(page)).toContain('Open briefs');
  });

  it('saves a new display name and time zone on the account page', async () => {
    const { page } = await session('desktop');
    await page.goto(world.url('/account'));
    // Signed out: the account page sends you to sign in and back again.
    await page.waitForURL('**/sign-in?next=%2Faccount');
    await page.getByLabel('Email').fill('pim@kitlane.test');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/account');

    await page.getByLabel('Display name').fill('Pim at the Kit');
    await page.getByLabel('Time zone').selectOption('America/Sao_Paulo');
    await page.getByRole('button', { name: 'Save changes' }).click();
    await eventually(() => page.getByText('Your account is saved.').count()).toBe(1);
    expect(await page.getByRole('button', { name: /Pim at the Kit.*account menu/ }).count()).toBe(1);

    await page.reload();
    expect(await page.getByLabel('Time zone').inputValue()).toBe('America/Sao_Paulo');
    expect(await page.getByLabel('Display name').inputValue()).toBe('Pim at the Kit');
  });
});

describe('weight of the first page', () => {
  it('downloads at most 180 kB of gzipped JavaScript for the home page', async () => {
    const { page } = await session('desktop');
    const scripts = new Map<string, number>();
    page.on('response', async (response) => {
      if (response.request().resourceType() !== 'script') return;
      scripts.set(response.url(), gzipSync(await response.body()).length);
    });
    await page.goto(world.url('/'), { waitUntil: 'networkidle' });
    await eventually(() => page.getByRole('heading', { level: 1 }).count()).toBe(1);
    const totalKb = [...scripts.values()].reduce((a, b) => a + b, 0) / 1024;
    console.info(`home page JavaScript: ${scripts.size} files, ${totalKb.toFixed(1)} kB gzip`);
    // The sign-up form code (react-hook-form, zod) is not needed to read the home page.
    expect([...scripts.keys()].some((url) => /sign-up/.test(url))).toBe(false);
    expect(totalKb).toBeLessThanOrEqual(180);
  });
});

describe('accessibility of the public pages', () => {
  const PUBLIC_PAGES = [
    { name: 'home', path: '/', heading: /Real drums on your song/ },
    { name: 'sign-in', path: '/sign-in', heading: /Sign in/ },
    { name: 'sign-up', path: '/sign-up', heading: /Join Kitlane/ },
    { name: 'not-found', path: '/no-such-page', heading: /Page not found/ },
  ];

  for (const viewport of ['desktop', 'mobile'] as const) {
    for (const target of PUBLIC_PAGES) {
      it(`finds no serious or critical axe violations on ${target.name} (${viewport})`, async () => {
        const { page } = await session(viewport);
        await page.goto(world.url(`${target.path}`));
        await eventually(() => page.getByRole('heading', { level: 1 }).innerText()).toMatch(target.heading);
        expect(await page.getByRole('heading', { level: 1 }).count(), 'one h1 per page').toBe(1);
        expect(await page.getByRole('main').count()).toBe(1);
        expect(await page.getByRole('banner').count()).toBe(1);
        expect(await page.getByRole('contentinfo').count()).toBe(1);
        // The footer links to the local inbox because this server runs on the fakes.
        expect(await page.getByRole('link', { name: 'Local mail inbox' }).getAttribute('href')).toBe(world.server.mailWebUrl);

        await screenshot(page, `${target.name}-${viewport}`);
        await expectAxeClean(page, `${target.name} (${viewport})`);
      });
    }
  }
});
