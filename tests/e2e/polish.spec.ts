// Issue 3 follow-ups, what a new user would trip on: the Open briefs budget filter takes major units, the
// brief owner invites drummers from a picker, the quote form names a room's mic package instead of an
// account id, and "Message" buttons sit on the brief, compare and booking pages. Each page passes axe and
// leaves a screenshot (the filter and the picker also on a 390 px phone).
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot } from './helpers/browser';
import { expectAxeClean } from './helpers/a11y';
import { eventually, useE2eWorld } from './helpers/world';

const SONGWRITER = 'ines@kitlane.test';
const DRUMMER = 'pim@kitlane.test';

const world = useE2eWorld();
const { session, signIn } = world;

type PackageChoice = { roomName: string; packageName: string; currency: string };

/** A room with an offered mic package from the demo seed; the brief is priced in its currency so it can be named. */
async function demoPackage(page: Page): Promise<PackageChoice> {
  const rooms = (await (await page.request.get(world.url('/api/rooms'))).json()) as { items: { id: string; name: string }[] };
  for (const room of rooms.items) {
    const list = (await (await page.request.get(world.url(`/api/rooms/${room.id}/packages`))).json()) as { items: { name: string; currency: string; archived: boolean }[] };
    const offered = list.items.find((p) => !p.archived);
    if (offered) return { roomName: room.name, packageName: offered.name, currency: offered.currency };
  }
  throw new Error('The demo seed has no room with a mic package');
}

describe('marketplace polish', () => {
  const title = `Paper Lanterns ${Date.now()}`;
  let briefId: string;
  let pkg: PackageChoice;
  let drummerName: string;

  it('lets the brief owner invite a drummer from a search picker and shows who is invited', async () => {
    const songwriter = await session('mobile');
    await signIn(songwriter.page, SONGWRITER);
    pkg = await demoPackage(songwriter.page);
    briefId = await world.publishBrief(songwriter.page, { songTitle: title, currency: pkg.currency, budgetMinMinor: 30000, budgetMaxMinor: 45050 });
    const me = (await (await songwriter.page.request.get(world.url('/api/drummers?q=Pim'))).json()) as { items: { displayName: string }[] };
    drummerName = me.items[0].displayName;

    await songwriter.page.goto(world.url(`/briefs/${briefId}`));
    const picker = songwriter.page.getByRole('region', { name: 'Invite drummers' });
    await eventually(() => picker.getByText('Nobody invited yet').count()).toBe(1);
    await picker.getByRole('searchbox', { name: 'Find a drummer' }).fill(drummerName);
    const invite = picker.getByRole('button', { name: `Invite ${drummerName}` });
    await eventually(() => invite.count()).toBe(1);
    await expectAxeClean(songwriter.page, 'brief owner page with the invite picker');
    await invite.click();
    await eventually(() => picker.getByRole('list', { name: 'Invited drummers' }).innerText()).toContain(drummerName);
    await screenshot(songwriter.page, 'polish-invite-mobile');
  });

  it('filters open briefs by a budget typed in major units, and says so when the amount is unreadable', async () => {
    const drummer = await session('mobile');
    await signIn(drummer.page, DRUMMER);
    await drummer.page.goto(world.url('/briefs'));
    const filters = drummer.page.getByRole('form', { name: 'Filter open briefs' });
    await filters.getByLabel('Currency').selectOption(pkg.currency);
    await filters.getByLabel('Budget reaches at least').fill('12.345');
    await filters.getByRole('button', { name: 'Filter' }).click();
    await eventually(() => filters.getByText(/at most 2 decimals/).count()).toBe(1);

    await filters.getByLabel('Budget reaches at least').fill('450.50');
    await filters.getByRole('button', { name: 'Filter' }).click();
    await eventually(() => new URL(drummer.page.url()).searchParams.get('budgetMin')).toBe('45050');
    expect(new URL(drummer.page.url()).searchParams.get('currency')).toBe(pkg.currency);
    await eventually(() => drummer.page.getByRole('link', { name: title }).count()).toBe(1);
    // The field shows the amount back as it was typed, not in minor units.
    expect(await filters.getByLabel('Budget reaches at least').inputValue()).toBe('450.50');
    await expectAxeClean(drummer.page, 'open briefs with a budget filter');
    await screenshot(drummer.page, 'polish-open-briefs-budget-mobile');

    await filters.getByLabel('Budget reaches at least').fill('450.51');
    await filters.getByRole('button', { name: 'Filter' }).click();
    await eventually(() => drummer.page.getByRole('link', { name: title }).count()).toBe(0);
  });

  it('lets a drummer quote with a room’s mic package picked from a list, and message the songwriter', async () => {
    const drummer = await session('desktop');
    await signIn(drummer.page, DRUMMER);
    await drummer.page.goto(world.url(`/briefs/${briefId}`));
    await eventually(() => drummer.page.getByRole('heading', { name: 'Send a quote' }).count()).toBe(1);
    expect(await drummer.page.getByRole('button', { name: /^Message / }).count()).toBe(1);

    await drummer.page.getByLabel('Fee per song').fill('180');
    await drummer.page.getByLabel(/I record in a room listed on Kitlane/).check();
    await drummer.page.getByRole('searchbox', { name: 'Find a room' }).fill(pkg.roomName);
    await drummer.page.getByRole('radio', { name: new RegExp(pkg.roomName) }).check();
    await drummer.page.getByRole('radio', { name: new RegExp(pkg.packageName) }).check();
    await eventually(() => drummer.page.getByText(/is added to the quote total as/).count()).toBe(1);
    await expectAxeClean(drummer.page, 'quote form with the package picker');
    await screenshot(drummer.page, 'polish-quote-package');
    await drummer.page.getByRole('button', { name: 'Send quote' }).click();
    await eventually(() => drummer.page.url()).toMatch(/\/quotes\//);
    await eventually(() => drummer.page.getByTestId('quote-package').innerText()).toContain(pkg.packageName);
  });

  it('puts a message button on each quote in the comparison that opens the conversation with that drummer', async () => {
    const songwriter = await session('desktop');
    await signIn(songwriter.page, SONGWRITER);
    await songwriter.page.goto(world.url(`/briefs/${briefId}/quotes`));
    const message = songwriter.page.getByRole('button', { name: `Message ${drummerName}` });
    await eventually(() => message.count()).toBe(1);
    await expectAxeClean(songwriter.page, 'compare quotes with message buttons');
    await screenshot(songwriter.page, 'polish-compare-message');
    await message.click();
    await eventually(() => songwriter.page.url()).toMatch(/\/messages\//);
  });

  it('opens the booking’s conversation from the booking page, for a party to the booking', async () => {
    const songwriter = await session('mobile');
    await signIn(songwriter.page, 'mara@kitlane.test');
    const list = (await (await songwriter.page.request.get(world.url('/api/bookings'))).json()) as { items: { id: string }[] };
    expect(list.items.length).toBeGreaterThan(0);
    await songwriter.page.goto(world.url(`/bookings/${list.items[0].id}`));
    const message = songwriter.page.getByRole('button', { name: 'Message about this booking' });
    await eventually(() => message.count()).toBe(1);
    await screenshot(songwriter.page, 'polish-booking-message-mobile');
    await message.click();
    await eventually(() => songwriter.page.url()).toMatch(/\/messages\//);
  });
});
