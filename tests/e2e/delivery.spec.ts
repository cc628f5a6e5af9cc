// Issue 5, browser part: a drummer uploads a 3-stem delivery with visible progress (one upload paused mid-way,
// which cuts its request, and resumed from the server's offset), the check report appears, the songwriter
// plays the stems in the review room, mutes one, leaves a note on the timeline and requests changes; v2 is
// accepted and the originals unlock. Demo accounts from the seed: teo hired juno for "Quiet Harbour" (funded).
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { renderKit, writeWav } from '../../server/audio/testing/synth-wav';
import { screenshot } from './helpers/browser';
import { expectAxeClean } from './helpers/a11y';
import { useE2eWorld } from './helpers/world';

const NAMES = ['Kick In.wav', 'Snare Top.wav', 'Snare Bottom.wav'];

const world = useE2eWorld();
const { signedIn, openBooking } = world;
let stemDir: string;

beforeAll(async () => {
  stemDir = mkdtempSync(join(tmpdir(), 'kitlane-e2e-stems-'));
  // 24 s of 24-bit 48 kHz each (~3.5 MB): long enough to pause an upload half-way on a throttled link, and
  // longer than the part the review room decodes first, so the switch to the whole stems is exercised.
  const kit = renderKit({ sampleRate: 48_000, seconds: 24, tempo: 120, seed: 11 });
  for (const name of NAMES) await writeWav(join(stemDir, name), [kit.find((s) => s.name === name)!.samples], { sampleRate: 48_000, bits: 24 });
});

afterAll(() => rmSync(stemDir, { recursive: true, force: true }));

/** The row's percentage; a finished upload drops its progress line, so "uploaded" reads as 100. */
async function percentOf(page: Page, name: string): Promise<number> {
  const row = page.locator(`[data-file-name="${name}"]`);
  if ((await row.getByText(/· uploaded ·/).count()) > 0) return 100;
  const percent = row.locator('[data-testid="upload-percent"]');
  if ((await percent.count()) === 0) return 0;
  return Number(((await percent.textContent()) ?? '0%').replace('%', ''));
}

async function uploadAndSubmit(page: Page, version: number, opts: { interrupt: boolean }): Promise<void> {
  await openBooking(page, 'Quiet Harbour');
  await page.getByRole('button', { name: `Start delivery v${version}` }).click();
  await page.waitForURL(/\/deliveries\/[^/?]+$/);
  const cdp = opts.interrupt ? await page.context().newCDPSession(page) : null;
  // A slow uplink (400 kB/s) so progress is visible and one upload can be paused mid-way.
  await cdp?.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: 400_000 });
  await page.getByLabel('Add WAV stems').setInputFiles(NAMES.map((n) => join(stemDir, n)));
  await expect.poll(() => page.getByTestId('upload-row').count(), { timeout: 15_000 }).toBe(3);
  if (opts.interrupt) {
    await expect.poll(() => percentOf(page, 'Snare Bottom.wav'), { timeout: 30_000 }).toBeGreaterThan(5);
    await page.getByRole('button', { name: 'Pause Snare Bottom.wav' }).click();
    const paused = await percentOf(page, 'Snare Bottom.wav');
    expect(paused).toBeGreaterThan(0);
    expect(paused).toBeLessThan(100);
    await expect.poll(() => page.locator('[data-file-name="Snare Bottom.wav"]').getByText('Paused').count()).toBe(1);
    await screenshot(page, 'delivery-upload-paused-desktop');
    await expectAxeClean(page, 'the paused upload');
    await cdp?.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
    await page.getByRole('button', { name: 'Resume Snare Bottom.wav' }).click();
    // Resumed from the server's offset, not from zero.
    await expect.poll(() => percentOf(page, 'Snare Bottom.wav'), { timeout: 20_000 }).toBeGreaterThanOrEqual(Math.min(paused, 99));
  }
  await expect.poll(() => page.getByTestId('check-summary').count(), { timeout: 90_000 }).toBe(1);
  expect(await page.getByTestId('check-summary').textContent()).toMatch(/3 stems, 48 kHz \/ 24-bit/);
  await expect.poll(() => page.getByRole('button', { name: 'Submit for review' }).isEnabled(), { timeout: 60_000 }).toBe(true);
  if (version === 1) await screenshot(page, 'delivery-checked-desktop');
  await page.getByRole('button', { name: 'Submit for review' }).click();
  await expect.poll(() => page.getByText('Submitted').count(), { timeout: 15_000 }).toBeGreaterThan(0);
}

async function openReviewRoom(page: Page, version: number): Promise<number> {
  await openBooking(page, 'Quiet Harbour');
  await page.getByRole('link', { name: `Open the review room v${version}` }).click();
  await page.waitForURL(/\/deliveries\/[^/?]+$/);
  const play = page.getByTestId('transport-play');
  await expect.poll(() => play.isEnabled(), { timeout: 20_000 }).toBe(true);
  return page.evaluate(() => performance.measure('open-to-playable', 'review-open', 'review-playable').duration);
}

describe('delivering stems and reviewing them', () => {
  it('uploads v1 with one upload paused and resumed, and the check report appears', async () => {
    const { page } = await signedIn('juno@kitlane.test');
    await uploadAndSubmit(page, 1, { interrupt: true });
  }, 240_000);

  it('lets the songwriter play the stems, mute one, leave a note and request changes', async () => {
    const { page } = await signedIn('teo@kitlane.test');
    // Records when each document opens an audio output (set up before the booking page loads).
    await page.addInitScript(() => {
      const w = window as unknown as { AudioContext: typeof AudioContext; audioOutputsAt: number[] };
      const Real = w.AudioContext;
      w.audioOutputsAt = [];
      w.AudioContext = class extends Real {
        constructor(options?: AudioContextOptions) {
          super(options);
          w.audioOutputsAt.push(performance.now());
        }
      };
    });
    const openToPlayableMs = await openReviewRoom(page, 1);
    expect(openToPlayableMs).toBeLessThan(2000);
    await expect.poll(() => page.getByTestId('stem-row').count()).toBe(3);
    await page.getByTestId('transport-play').click();
    // Decoding needs no audio output: the one output opens only once the room is playable (opening it blocks a while).
    const outputs = await page.evaluate(() => ({ at: (window as unknown as { audioOutputsAt: number[] }).audioOutputsAt, playable: performance.getEntriesByName('review-playable')[0].startTime }));
    expect(outputs.at).toHaveLength(1);
    expect(outputs.at[0]).toBeGreaterThanOrEqual(outputs.playable);
    await expect.poll(() => page.getByTestId('transport-play').getAttribute('aria-pressed')).toBe('true');
    // The transport moves.
    await expect.poll(async () => (await page.getByLabel('Position').textContent())?.startsWith('0:00.0'), { timeout: 5_000 }).toBe(false);
    // The whole stems take over from the first decoded part while playing, and playback goes on.
    await expect.poll(() => page.evaluate(() => performance.getEntriesByName('review-whole').length), { timeout: 20_000 }).toBe(1);
    const before = await page.getByLabel('Position').textContent();
    await expect.poll(() => page.getByLabel('Position').textContent(), { timeout: 5_000 }).not.toBe(before);
    const mute = page.getByRole('button', { name: 'Mute Snare bottom' });
    await mute.click();
    expect(await mute.getAttribute('aria-pressed')).toBe('true');
    await page.getByTestId('transport-play').click();
    // A note at about a third of the way along the snare top's lane.
    const lane = page.getByTestId('stem-lane').nth(1);
    const box = (await lane.boundingBox())!;
    await page.mouse.click(box.x + box.width / 3, box.y + box.height / 2);
    await page.getByLabel(/^Note at/).fill('The snare is a touch late in this fill');
    await page.getByRole('button', { name: 'Save note' }).click();
    await expect.poll(() => page.getByRole('list', { name: 'Notes on the timeline' }).getByText('The snare is a touch late in this fill').count()).toBe(1);
    await expectAxeClean(page, 'the review room');
    await screenshot(page, 'delivery-review-room-desktop');
    await page.getByRole('button', { name: /^Request changes \(1 note\)/ }).click();
    await expect.poll(() => page.getByText('Changes were asked for on this version.').count(), { timeout: 10_000 }).toBe(1);
    const mail = await world.server.waitForMail('juno@kitlane.test', /Changes asked for/);
    expect(mail.text).toContain('The snare is a touch late in this fill');
  }, 120_000);

  it('accepts v2, and the originals unlock', async () => {
    const drummer = await signedIn('juno@kitlane.test');
    await uploadAndSubmit(drummer.page, 2, { interrupt: false });
    const { page } = await signedIn('teo@kitlane.test');
    await openReviewRoom(page, 2);
    await page.getByRole('button', { name: 'Accept delivery' }).click();
    await page.getByRole('button', { name: 'Yes, accept and release the payment' }).click();
    await expect.poll(() => page.getByRole('link', { name: 'Download all as a zip' }).count(), { timeout: 15_000 }).toBe(1);
    expect(await page.getByText('Accepted').count()).toBeGreaterThan(0);
    await screenshot(page, 'delivery-accepted-desktop');
  }, 240_000);
});
