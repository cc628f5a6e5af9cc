// Issue 4, browser part: the admin splits the demo's open dispute 70/30 on the admin desk after a
// confirmation step with the exact amounts; the songwriter and the drummer then see the decision and their
// receipts on the booking page. Demo accounts from the seed; the desk and the booking page pass axe.
import { describe, expect, it } from 'vitest';
import { screenshot } from './helpers/browser';
import { expectAxeClean } from './helpers/a11y';
import { useE2eWorld } from './helpers/world';

const world = useE2eWorld();
const { signedIn, openBooking } = world;

describe('settling a dispute in the browser', () => {
  it('splits the open dispute 70/30; both sides then see the decision and their receipts', async () => {
    const admin = await signedIn('admin@kitlane.test');
    await admin.page.goto(world.url('/admin'));
    const queue = admin.page.getByRole('region', { name: 'Open disputes' }).or(admin.page.locator('section[aria-labelledby="open-disputes"]'));
    await expect.poll(() => queue.getByTestId('dispute-row').count(), { timeout: 10_000 }).toBe(1);
    await expectAxeClean(admin.page, 'the dispute queue');
    await screenshot(admin.page, 'admin-dispute-queue-desktop');

    await queue.getByRole('link', { name: 'Lamplight Verse' }).click();
    await admin.page.waitForURL(/\/admin\/disputes\//);
    await expect.poll(() => admin.page.getByRole('heading', { name: 'Agreed terms' }).count(), { timeout: 10_000 }).toBe(1);
    expect(await admin.page.getByText('No delivery yet').count()).toBe(1);
    // 220.00 agreed (the seed's fee) is held in escrow.
    expect(await admin.page.getByTestId('escrow-held').innerText()).toBe('$220.00');
    await expectAxeClean(admin.page, 'the dispute case');
    await screenshot(admin.page, 'admin-dispute-case-desktop');

    const form = admin.page.getByRole('form', { name: 'Settle the dispute' });
    await form.getByRole('button', { name: 'Review the amounts' }).click();
    await expect.poll(() => form.getByText('Enter the songwriter’s percentage').count()).toBe(1);
    await form.getByLabel('Percentage back to the songwriter').fill('70');
    await form.getByLabel('Your reasons').fill('Three stems were unusable; the drummer is paid for the rest of the work.');
    await form.getByRole('button', { name: 'Review the amounts' }).click();

    // 70 % of 220.00 = 154.00 back; 66.00 released, less the 10 % commission (6.60) = 59.40 to the drummer.
    const preview = admin.page.getByTestId('settlement-preview');
    await expect.poll(() => preview.count(), { timeout: 10_000 }).toBe(1);
    expect(await admin.page.getByTestId('preview-songwriter').innerText()).toBe('$154.00');
    expect(await admin.page.getByTestId('preview-drummer').innerText()).toBe('$66.00 − commission $6.60 = $59.40');
    await expectAxeClean(admin.page, 'the settlement preview');
    await screenshot(admin.page, 'admin-dispute-confirm-desktop');
    await admin.page.getByRole('button', { name: 'Confirm and settle' }).click();
    await expect.poll(() => admin.page.getByTestId('dispute-decision').count(), { timeout: 15_000 }).toBe(1);
    expect(await admin.page.getByTestId('decision-songwriter').innerText()).toBe('$154.00');
    await screenshot(admin.page, 'admin-dispute-settled-desktop');

    for (const [email, receipt] of [
      ['mara@kitlane.test', /Refunded to the songwriter/],
      ['kofi@kitlane.test', /Transferred to the payee/],
    ] as const) {
      const party = await signedIn(email);
      await openBooking(party.page, 'Lamplight Verse');
      const decision = party.page.getByTestId('dispute-decision');
      await expect.poll(() => decision.count(), { timeout: 10_000 }).toBe(1);
      expect(await party.page.getByTestId('decision-songwriter').innerText()).toBe('$154.00');
      expect(await party.page.getByTestId('decision-payees').innerText()).toContain('$66.00');
      const receipts = party.page.locator('section[aria-labelledby="receipts-title"]');
      await expect.poll(() => receipts.getByText(receipt).count(), { timeout: 10_000 }).toBeGreaterThan(0);
      await expectAxeClean(party.page, 'the settled booking page');
      await screenshot(party.page, `booking-dispute-settled-${email.split('@')[0]}-desktop`);
    }
  }, 120_000);
});
