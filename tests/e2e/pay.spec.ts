// Issue 4, browser part: a songwriter pays on the payment fake's hosted page (a declined card first shows
// its reason and leaves the booking payable, then the success card funds it); a payee onboards from the
// account page. Demo accounts from the seed; the money panel passes an axe check.
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { screenshot } from './helpers/browser';
import { expectAxeClean } from './helpers/a11y';
import { useE2eWorld } from './helpers/world';

const world = useE2eWorld();
const { signedIn } = world;

function moneyPanel(page: Page) {
  return page.getByRole('region', { name: 'Payment' });
}

describe('paying into escrow in the browser', () => {
  it('shows a declined card’s reason, keeps the booking payable, then funds it with the success card', async () => {
    const { page, problems } = await signedIn('teo@kitlane.test');
    // The fake's hosted page answers a decline with HTTP 402, which Chromium logs as a failed resource.
    problems.ignoreConsoleError(/status of 402/);
    // The fake's pages have no icon; Chromium asks for one anyway.
    problems.ignoreConsoleError(/favicon\.ico/);
    await page.goto(world.url('/bookings'));
    await page.getByRole('link', { name: 'Low Tide Motel' }).click();
    await page.waitForURL(/\/bookings\/[^/?]+$/);
    const bookingPage = page.url();
    const panel = moneyPanel(page);
    await expect.poll(() => panel.getByText('Awaiting payment').count(), { timeout: 10_000 }).toBeGreaterThan(0);
    await expect.poll(() => panel.getByText(/not a licensed escrow service/).count()).toBe(1);
    await expectAxeClean(page, 'the booking awaiting payment');
    await screenshot(page, 'booking-awaiting-payment-desktop');

    await panel.getByRole('button', { name: /^Pay / }).click();
    await page.waitForURL(/\/checkout\/cs_/);
    await page.getByLabel('Card number').fill('4000 0000 0000 0002');
    await page.getByRole('button', { name: /^Pay/ }).click();
    await expect.poll(() => page.getByText(/declined/i).count(), { timeout: 10_000 }).toBeGreaterThan(0);
    await screenshot(page, 'checkout-declined-desktop');

    // Back on the booking without paying: the decline is shown there too, and it can still be paid.
    await page.goto(bookingPage);
    await expect.poll(() => moneyPanel(page).getByText('The card was declined').count(), { timeout: 10_000 }).toBe(1);
    await screenshot(page, 'booking-after-decline-desktop');
    await moneyPanel(page).getByRole('button', { name: /^Pay / }).click();
    await page.waitForURL(/\/checkout\/cs_/);
    await page.getByLabel('Card number').fill('4242 4242 4242 4242');
    await page.getByRole('button', { name: /^Pay/ }).click();

    await page.waitForURL(/\/bookings\/[^?]+\?checkout=success/);
    await expect.poll(() => moneyPanel(page).getByText('Funded: money held').count(), { timeout: 15_000 }).toBe(1);
    await expect.poll(() => moneyPanel(page).getByRole('heading', { name: 'Receipts' }).count()).toBe(1);
    await expectAxeClean(page, 'the funded booking');
    await screenshot(page, 'booking-funded-desktop');
  });

  it('lets a payee set up payouts on the processor’s onboarding page', async () => {
    const { page } = await signedIn('pim@kitlane.test');
    await page.goto(world.url('/account#payouts'));
    const section = page.getByRole('region', { name: 'Payouts' });
    await expect.poll(() => section.getByText('Not set up').count(), { timeout: 10_000 }).toBe(1);
    await expectAxeClean(page, 'the payouts section');
    await screenshot(page, 'account-payouts-not-set-up-desktop');
    await section.getByRole('button', { name: 'Set up payouts' }).click();
    await page.waitForURL(/\/onboarding\//);
    await page.getByRole('button', { name: /Finish onboarding/ }).click();
    await page.waitForURL(/\/account\?payouts=return/);
    await expect.poll(() => page.getByRole('region', { name: 'Payouts' }).getByText('Enabled').count(), { timeout: 10_000 }).toBe(1);
    await screenshot(page, 'account-payouts-enabled-desktop');
  });
});
