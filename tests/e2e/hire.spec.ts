// Issue 3, hiring part: a songwriter writes and publishes a brief with a guide track; a drummer finds it in
// open briefs and quotes; the songwriter compares and accepts; the booking page shows awaiting payment with
// the agreed total. Each page passes an axe check and leaves a screenshot.
import { describe, expect, it } from 'vitest';
import { formatMoney } from '@shared/money';
import { screenshot } from './helpers/browser';
import { expectAxeClean } from './helpers/a11y';
import { eventually, h1, useE2eWorld } from './helpers/world';
import { daysFromToday, demoGuide } from '../api/helpers/hire';

const SONGWRITER = 'mara@kitlane.test';
const DRUMMER = 'sada@kitlane.test';

const world = useE2eWorld();
const { session, signIn } = world;

describe('hiring a drummer', () => {
  it('goes from a published brief with a guide track to a booking awaiting payment', async () => {
    const title = `Tin Roof Rain ${Date.now()}`;
    const songwriter = await session('desktop');
    await signIn(songwriter.page, SONGWRITER);

    // 1. The songwriter writes a draft.
    await songwriter.page.goto(world.url('/briefs/new'));
    await eventually(() => h1(songwriter.page)).toBe('New brief');
    const form = songwriter.page;
    await form.getByLabel('Song title').fill(title);
    await form.getByLabel('What the song is').fill('A slow funk song with a horn section; bass and keys are done.');
    await form.getByLabel('What the drums should do').fill('Tight hats, ghost notes, no crashes until the last chorus.');
    await form.getByLabel('Style').selectOption('funk');
    await form.getByLabel('Tempo (BPM)').fill('96');
    await form.getByLabel('Length in bars').fill('80');
    await form.getByLabel('Number of songs').fill('2');
    await form.getByLabel('Currency').selectOption('GBP');
    await form.getByLabel('Budget from (GBP)').fill('200');
    await form.getByLabel('Budget up to (GBP)').fill('450.50');
    await form.getByLabel('Deadline').fill(daysFromToday(30, 'Europe/London'));
    await expectAxeClean(form, 'the new brief form');
    await screenshot(form, 'hire-new-brief-desktop');
    await form.getByRole('button', { name: 'Save draft' }).click();

    await eventually(() => h1(songwriter.page)).toBe(title);
    const briefId = new URL(songwriter.page.url()).pathname.split('/').pop()!;
    expect(briefId).toMatch(/^[0-9a-f-]{36}$/);
    await eventually(() => songwriter.page.getByText('Draft', { exact: true }).count()).toBeGreaterThan(0);

    // 2. A guide track (synthesised click and bass), uploaded with progress; the waveform comes from the server.
    await songwriter.page.getByLabel('Guide track', { exact: true }).setInputFiles({ name: 'tin-roof-guide.wav', mimeType: 'audio/wav', buffer: demoGuide(6) });
    await songwriter.page.getByRole('button', { name: 'Upload guide track' }).click();
    await eventually(() => songwriter.page.getByText('The guide track is uploaded.').count()).toBe(1);
    const waveform = songwriter.page.getByRole('img', { name: /Waveform of the guide track/ });
    await eventually(() => waveform.evaluate((el) => el.children.length)).toBeGreaterThan(0);

    // 3. Publish.
    await songwriter.page.getByRole('button', { name: 'Publish brief' }).click();
    await eventually(() => songwriter.page.getByText('Open', { exact: true }).count()).toBeGreaterThan(0);
    await expectAxeClean(songwriter.page, 'the owner’s brief page');
    await screenshot(songwriter.page, 'hire-brief-owner-desktop');

    // 4. A drummer finds it in open briefs with a style filter (kept in the URL) and opens it.
    const drummer = await session('desktop');
    await signIn(drummer.page, DRUMMER);
    await drummer.page.goto(world.url('/briefs'));
    await eventually(() => h1(drummer.page)).toBe('Open briefs');
    await drummer.page.getByLabel('Style').selectOption('funk');
    await drummer.page.getByRole('button', { name: 'Filter' }).click();
    await eventually(() => new URL(drummer.page.url()).searchParams.get('style')).toBe('funk');
    const link = drummer.page.getByRole('link', { name: title });
    await eventually(() => link.count()).toBe(1);
    await expectAxeClean(drummer.page, 'open briefs');
    await screenshot(drummer.page, 'hire-open-briefs-desktop');
    await link.click();
    await eventually(() => h1(drummer.page)).toBe(title);
    const drummerWave = drummer.page.getByRole('img', { name: /Waveform of the guide track/ });
    await eventually(() => drummerWave.evaluate((el) => el.children.length)).toBeGreaterThan(0);

    // 5. The drummer quotes: 150 per song × 2 songs + 20 rush = 320 GBP, computed by the server.
    await drummer.page.getByLabel('Fee per song (GBP)').fill('150');
    await drummer.page.getByLabel('Rush fee (GBP)').fill('20');
    await drummer.page.getByLabel('Each extra revision (GBP)').fill('40');
    await drummer.page.getByLabel('Turnaround (days)').fill('6');
    await drummer.page.getByLabel('Message to the songwriter').fill('Right in my pocket. I will send a dry and a roomy set.');
    await expectAxeClean(drummer.page, 'the brief page with the quote form');
    await screenshot(drummer.page, 'hire-brief-drummer-desktop');
    await drummer.page.getByRole('button', { name: 'Send quote' }).click();
    await eventually(() => h1(drummer.page)).toBe(`Quote for ${title}`);
    const total = formatMoney(32000, 'GBP');
    await eventually(() => drummer.page.getByTestId('quote-total').innerText()).toBe(total);
    await expectAxeClean(drummer.page, 'the drummer’s quote page');

    // 6. The songwriter compares the quotes and accepts.
    await songwriter.page.goto(world.url(`/briefs/${briefId}/quotes`));
    await eventually(() => h1(songwriter.page)).toBe(`Quotes for ${title}`);
    await eventually(() => songwriter.page.getByTestId('quote-total').allInnerTexts()).toEqual([total]);
    await expectAxeClean(songwriter.page, 'the quote comparison');
    await screenshot(songwriter.page, 'hire-compare-quotes-desktop');
    await songwriter.page.getByRole('button', { name: /^Accept .+’s quote$/ }).click();

    // 7. The booking: awaiting payment, with the agreed total.
    await eventually(() => songwriter.page.url()).toMatch(/\/bookings\/[0-9a-f-]{36}$/);
    await eventually(() => songwriter.page.getByTestId('booking-status').getAttribute('data-status')).toBe('awaiting_payment');
    expect(await songwriter.page.getByTestId('booking-status').innerText()).toBe('Awaiting payment');
    expect(await songwriter.page.getByTestId('quote-total').innerText()).toBe(total);
    await expectAxeClean(songwriter.page, 'the booking page');
    await screenshot(songwriter.page, 'hire-booking-desktop');

    // The drummer is told, and the booking is theirs to see too.
    const mail = await world.server.waitForMail(DRUMMER, new RegExp(`quote for “${title}” was accepted`));
    const bookingLink = mail.links.find((l) => l.includes('/bookings/'));
    expect(bookingLink).toBeTruthy();
    await drummer.page.goto(bookingLink!);
    await eventually(() => drummer.page.getByTestId('booking-status').getAttribute('data-status')).toBe('awaiting_payment');
  });

  it('shows the comparison readably on a phone', async () => {
    const songwriter = await session('mobile');
    await signIn(songwriter.page, 'teo@kitlane.test');
    await songwriter.page.goto(world.url('/briefs/mine'));
    await eventually(() => h1(songwriter.page)).toBe('My briefs');
    await expectAxeClean(songwriter.page, 'my briefs');
    await screenshot(songwriter.page, 'hire-my-briefs-mobile');
    await songwriter.page.getByRole('link', { name: /quotes?$/ }).first().click();
    await eventually(() => h1(songwriter.page)).toMatch(/^Quotes for /);
    await eventually(() => songwriter.page.getByTestId('quote-total').count()).toBeGreaterThan(0);
    await expectAxeClean(songwriter.page, 'the quote comparison on a phone');
    await screenshot(songwriter.page, 'hire-compare-quotes-mobile');
  });
});
