// Issue 3, browser part A: a drummer edits the profile and uploads a reel track (progress visible), the
// public profile plays it from precomputed peaks; a visitor searches with filters, reloads the URL and sees
// the same results, and a search without matches offers ways out. Axe on every page.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { screenshot } from './helpers/browser';
import { expectAxeClean } from './helpers/a11y';
import { eventually, h1, useE2eWorld } from './helpers/world';
import { synthReelWav } from '../../server/features/reels/reel-synth';

const DRUMMER = 'juno@kitlane.test';

const world = useE2eWorld();
const { session, signIn } = world;
let dir = '';

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'kitlane-e2e-reel-'));
});

afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
});

const resultNames = (page: Page) => page.getByTestId('drummer-results').getByRole('heading', { level: 2 }).allInnerTexts();

describe('drummer profiles, reels and search in the browser', () => {
  let publicUrl = '';
  const headline = `Big-room rock drums, tested ${Date.now()}`;

  it('edits the profile and uploads a reel track with visible progress', async () => {
    const { page, context } = await session('desktop');
    await signIn(page, DRUMMER);
    await page.goto(world.url('/profile'));
    await eventually(() => h1(page)).toBe('My profile');
    const form = page.getByRole('form', { name: 'Drummer profile' });
    await form.getByLabel('Headline', { exact: true }).fill(headline);
    await form.getByLabel('Base rate per song', { exact: true }).fill('190.50');
    await form.getByLabel('Funk', { exact: true }).check();
    await expectAxeClean(page, 'my profile');
    await form.getByRole('button', { name: 'Save profile' }).click();
    await eventually(() => form.getByRole('status').innerText()).toMatch(/listed in drummer search/);

    // A slow uplink (CDP network emulation) so the upload takes long enough to watch its progress.
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 256 * 1024 });
    const wav = join(dir, 'bridge-take.wav');
    writeFileSync(wav, synthReelWav({ seconds: 12, tempo: 118, seed: 11 }));
    const upload = page.getByRole('form', { name: 'Add a reel track' });
    await upload.getByLabel('Audio file', { exact: true }).setInputFiles(wav);
    await upload.getByLabel('Title', { exact: true }).fill('Bridge take for the browser test');
    await upload.getByLabel('Style', { exact: true }).selectOption('rock');
    await upload.getByLabel('Tempo (BPM)', { exact: true }).fill('118');
    await upload.getByRole('button', { name: 'Upload track' }).click();
    const progress = upload.getByRole('progressbar');
    await progress.waitFor({ state: 'visible', timeout: 10_000 });
    await eventually(async () => Number(await progress.getAttribute('value'))).toBeGreaterThan(0);
    await screenshot(page, 'profiles-reel-upload-progress');
    await eventually(() => upload.getByRole('status').innerText(), 30_000).toMatch(/is on your reel/);
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
    await expect(page.getByText('Bridge take for the browser test').first()).toBeTruthy();
    await screenshot(page, 'profiles-my-profile');

    await page.getByRole('link', { name: 'View my public page' }).click();
    await eventually(() => h1(page)).toBe('Juno Castellane');
    publicUrl = page.url();
  });

  it('plays the new reel track on the public profile from its precomputed waveform', async () => {
    const { page } = await session('desktop');
    const peaksRequests: string[] = [];
    page.on('request', (r) => {
      if (r.url().includes('/peaks')) peaksRequests.push(r.url());
    });
    await page.goto(publicUrl);
    await eventually(() => page.getByRole('heading', { level: 1 }).innerText()).toBe('Juno Castellane');
    await expect(await page.getByText(headline).count()).toBe(1);
    const player = page.getByTestId('reel-player').filter({ hasText: 'Bridge take for the browser test' });
    await player.getByRole('img', { name: /Waveform of Bridge take/ }).locator('div').first().waitFor();
    const play = player.getByRole('button', { name: /Play/ });
    await eventually(() => play.isEnabled()).toBe(true);
    await play.click();
    await eventually(() => player.getByRole('button', { name: /Pause/ }).count(), 20_000).toBe(1);
    expect(peaksRequests.length).toBeGreaterThan(0);
    await expectAxeClean(page, 'public drummer profile');
    await screenshot(page, 'profiles-public-drummer');
  });

  it('searches with filters, keeps them in the URL and shows the same results after a reload', async () => {
    const { page } = await session('desktop');
    await page.goto(world.url('/drummers'));
    await eventually(() => h1(page)).toBe('Find drummers');
    const form = page.getByRole('search', { name: 'Find drummers' });
    await form.getByLabel('Words', { exact: true }).fill('pocket');
    await form.getByLabel('Style', { exact: true }).selectOption('funk');
    await form.getByLabel('Rate per song at most', { exact: true }).fill('300');
    await form.getByLabel('Currency', { exact: true }).selectOption('USD');
    await form.getByLabel('Only drummers taking work').check();
    await form.getByRole('button', { name: 'Search' }).click();
    await eventually(() => resultNames(page)).toEqual(['Odell Brisk']);
    const url = new URL(page.url());
    expect(Object.fromEntries(url.searchParams)).toEqual({ q: 'pocket', style: 'funk', maxRate: '300', currency: 'USD', takingWork: 'true' });
    await expectAxeClean(page, 'drummer search results');
    await screenshot(page, 'profiles-search-results');

    await page.reload();
    await eventually(() => resultNames(page)).toEqual(['Odell Brisk']);
    expect(await page.getByLabel('Words', { exact: true }).inputValue()).toBe('pocket');
    expect(await page.getByLabel('Only drummers taking work').isChecked()).toBe(true);
  });

  it('explains an empty search and lets the visitor drop one filter at a time', async () => {
    const { page } = await session('mobile');
    await page.goto(world.url('/drummers?q=pocket&maxRate=10&currency=USD'));
    await eventually(() => page.getByText(/No drummers match “pocket” with rate ≤ \$10\.00/).count()).toBe(1);
    await expectAxeClean(page, 'drummer search without results');
    await screenshot(page, 'profiles-search-empty-mobile');
    await page.getByRole('button', { name: 'Clear the rate filter' }).click();
    await eventually(() => resultNames(page)).toContain('Odell Brisk');
    expect(new URL(page.url()).searchParams.get('maxRate')).toBeNull();
  });
});
