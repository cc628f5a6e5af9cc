// Issue 6, browser part: an engineer lists a room with its surfaces and sees the acoustics plots, builds a
// 12-channel mic package from a template (reordered by keys, with a 3:1 warning and the channel-count field
// error), and a songwriter sees the room and the package on a quote that names it.
import { describe, expect, it } from 'vitest';
import { screenshot } from './helpers/browser';
import { expectAxeClean } from './helpers/a11y';
import { eventually, h1, useE2eWorld } from './helpers/world';
import { quoteBody } from '../api/helpers/hire';

const ENGINEER = 'bea@kitlane.test'; // USD, America/New_York
const SONGWRITER = 'teo@kitlane.test'; // USD
const DRUMMER = 'odell@kitlane.test';

const world = useE2eWorld();
const { session, signIn } = world;

describe('rooms and mic packages in the browser', () => {
  let roomUrl = '';
  let packageName = '';
  const roomName = `Cedar Room ${Date.now()}`;

  it('lists a room with surfaces and shows the RT60 and mode plots with the reading', async () => {
    const { page } = await session('desktop');
    await signIn(page, ENGINEER);
    await page.goto(world.url('/rooms/new'));
    await eventually(() => h1(page)).toBe('List a room');
    await page.getByLabel('Name', { exact: true }).fill(roomName);
    await page.getByLabel('Town', { exact: true }).fill('Vessary');
    await page.getByLabel('Inputs (preamps)', { exact: true }).fill('12');
    await page.getByLabel('Day rate (USD)', { exact: true }).fill('320');
    await page.getByLabel('Half-day rate (USD)', { exact: true }).fill('180');
    await page.getByLabel('Length (m)', { exact: true }).fill('7');
    await page.getByLabel('Width (m)', { exact: true }).fill('5.5');
    await page.getByLabel('Height (m)', { exact: true }).fill('3.2');
    await page.getByLabel('Floor', { exact: true }).selectOption('heavy_carpet_on_concrete');
    await page.getByLabel('Ceiling', { exact: true }).selectOption('__custom');
    await page.getByLabel('125 Hz', { exact: true }).fill('0.3');
    await page.getByRole('button', { name: 'Add a panel' }).click();
    await page.getByLabel('Area (m²)', { exact: true }).fill('1.5');
    await screenshot(page, 'room-form-desktop');
    await expectAxeClean(page, 'the room form');
    await page.getByRole('button', { name: 'Save the room' }).click();

    await eventually(() => h1(page)).toBe(roomName);
    roomUrl = page.url();
    const rt60 = page.getByRole('img', { name: /Reverberation time \(RT60\) per octave band/ });
    await rt60.waitFor();
    expect(await rt60.locator('circle').count()).toBe(6);
    await page.getByRole('img', { name: /Axial room modes/ }).waitFor();
    await eventually(() => page.getByText(/For drums this room reads/).count()).toBe(1);
    expect(await page.getByText(/Which formula to trust: (Sabine|Eyring)/).count()).toBe(1);
    expect(await page.getByText(/Thresholds \(common practice/).count()).toBe(1);
    expect(await page.getByText(/Schroeder \d+ Hz/).count()).toBeGreaterThan(0);
    // The hearing-safety panel: 100 dBA is preset; NIOSH allows 15 min (NIOSH 98-126).
    expect(await page.getByText('15 min a day').count()).toBe(1);
    await screenshot(page, 'room-detail-desktop');
    await expectAxeClean(page, 'the room page');
  });

  it('builds a 12-channel package from a template, reorders it by keys, and warns on 3:1', async () => {
    const { page } = await session('desktop');
    await signIn(page, ENGINEER);
    await page.goto(roomUrl);
    await page.getByRole('link', { name: 'Make a mic package' }).click();
    await eventually(() => h1(page)).toBe('New mic package');
    packageName = `Cedar twelve ${Date.now()}`;
    await page.getByLabel('Package name', { exact: true }).fill(packageName);
    await page.getByLabel('Price (USD)', { exact: true }).fill('95');
    await page.getByRole('button', { name: '12 channels' }).click();
    const rows = page.locator('[data-channel-index]');
    await eventually(() => rows.count()).toBe(12);

    // The template's snare top and hi-hat sit closer than 3:1 allows at the typical spacing.
    await eventually(() => page.getByTestId('three-to-one-warning').count()).toBeGreaterThan(0);
    expect(await page.getByTestId('three-to-one-warning').first().innerText()).toMatch(/Snare top.*Hi-hat.*3:1/);
    // Placement guidance beside the channel, marked as common practice.
    expect(await page.getByText('Placement: Hi-hat (common practice)').count()).toBe(1);

    // Keyboard reorder: Alt+ArrowDown on the focused first row moves it, and it is announced.
    await rows.first().focus();
    await page.keyboard.press('Alt+ArrowDown');
    await eventually(() => page.getByTestId('reorder-announcement').innerText()).toBe('Kick in moved to position 2 of 12.');
    expect(await rows.nth(0).getByLabel('Source', { exact: true }).inputValue()).toBe('kick_out');
    expect(await rows.nth(1).getByLabel('Source', { exact: true }).inputValue()).toBe('kick_in');

    // A thirteenth channel is more than the room's 12 inputs: a field error, cleared again on removal.
    await page.getByRole('button', { name: 'Add a channel' }).click();
    await eventually(() => page.getByTestId('channels-error').innerText()).toBe('This package has 13 channels but the room has 12 inputs');
    await screenshot(page, 'package-editor-desktop');
    await expectAxeClean(page, 'the package editor');
    await page.getByRole('button', { name: 'Remove channel 13' }).click();
    await eventually(() => page.getByTestId('channels-error').count()).toBe(0);

    await page.getByRole('button', { name: 'Save the package' }).click();
    await eventually(() => h1(page)).toBe(roomName);
    await eventually(() => page.getByRole('heading', { name: packageName }).count()).toBe(1);
  });

  it('shows the songwriter the room and the package on a quote that names them', async () => {
    const engineer = await session('desktop');
    await signIn(engineer.page, ENGINEER);
    const roomId = roomUrl.split('/').pop()!;
    const packages = await (await engineer.page.request.get(world.url(`/api/rooms/${roomId}/packages`))).json();
    const packageId = packages.items.find((p: { name: string }) => p.name === packageName).id as string;

    const songwriter = await session('desktop');
    await signIn(songwriter.page, SONGWRITER);
    const briefId = await world.publishBrief(songwriter.page, { songTitle: `Room test ${Date.now()}`, currency: 'USD' });

    const drummer = await session('desktop');
    await signIn(drummer.page, DRUMMER);
    const quote = await drummer.page.request.post(world.url(`/api/briefs/${briefId}/quotes`), { data: quoteBody({ packageId }) });
    expect(quote.status()).toBe(201);

    await songwriter.page.goto(world.url(`/briefs/${briefId}/quotes`));
    const summary = songwriter.page.getByTestId('quote-package');
    await eventually(() => summary.innerText()).toContain(roomName);
    expect(await summary.innerText()).toContain(packageName);
    expect(await summary.innerText()).toMatch(/12 channels/);
    await screenshot(songwriter.page, 'quote-with-room-package-desktop');
    await expectAxeClean(songwriter.page, 'the compare view with a package');

    // The room page is open to the songwriter, plots included.
    await summary.getByRole('link', { name: roomName }).click();
    await eventually(() => h1(songwriter.page)).toBe(roomName);
    await songwriter.page.getByRole('img', { name: /Reverberation time/ }).waitFor();
    await eventually(() => songwriter.page.getByRole('heading', { name: packageName }).count()).toBe(1);
    expect(await songwriter.page.getByRole('button', { name: 'Edit room' }).count()).toBe(0);
  });

  it('lays the room page out on a phone', async () => {
    const { page } = await session('mobile');
    await page.goto(roomUrl);
    await eventually(() => h1(page)).toBe(roomName);
    await page.getByRole('img', { name: /Reverberation time/ }).waitFor();
    await screenshot(page, 'room-detail-mobile');
    await expectAxeClean(page, 'the room page on a phone');
  });
});
