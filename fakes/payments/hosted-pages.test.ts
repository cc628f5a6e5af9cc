import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import type { PaymentsFake } from './server';
import { checkoutParams, sdkFor, startTestFake, tempStateFile } from './test-support';

let fake: PaymentsFake;
let stripe: Stripe;
let cleanup: () => void;

beforeEach(async () => {
  const temp = tempStateFile();
  cleanup = temp.cleanup;
  fake = await startTestFake({ stateFile: temp.file });
  stripe = sdkFor(fake);
});

afterEach(async () => {
  await fake.close();
  cleanup();
});

function postForm(url: string, fields: Record<string, string>): Promise<Response> {
  return fetch(url, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: new URLSearchParams(fields).toString(), redirect: 'manual' });
}

describe('hosted checkout page', () => {
  it('shows the formatted amount, the line items, a labelled card field and the test-mode notice', async () => {
    const session = await stripe.checkout.sessions.create({
      ...checkoutParams(0),
      line_items: [
        { price_data: { currency: 'usd', unit_amount: 45_000, product_data: { name: 'Drum tracking, one song' } }, quantity: 1 },
        { price_data: { currency: 'usd', unit_amount: 2_750, product_data: { name: 'Service fee <songwriter>' } }, quantity: 1 },
      ],
    });
    const response = await fetch(session.url as string);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/text\/html/);
    const html = await response.text();
    expect(html).toContain('Test payment page — local fake, no real money');
    expect(html).toContain('$477.50');
    expect(html).toContain('$450.00');
    expect(html).toContain('Drum tracking, one song');
    // Item names are escaped, not injected.
    expect(html).toContain('Service fee &lt;songwriter&gt;');
    expect(html).toMatch(/<label for="card">Card number<\/label>/);
    expect(html).toMatch(/<input id="card" name="card"/);
    expect(html).toContain('<html lang="en">');
    expect(html).toContain('href="http://app.test/bookings/b1"');
  });

  it('redirects with 303 to the success url after the success card', async () => {
    const session = await stripe.checkout.sessions.create(checkoutParams(30_000));
    const response = await postForm(session.url as string, { card: '4242 4242 4242 4242' });
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe(`http://app.test/bookings/b1/paid?session=${session.id}`);
    expect((await stripe.checkout.sessions.retrieve(session.id)).payment_status).toBe('paid');
    const revisit = await (await fetch(`${fake.url}/checkout/${session.id}`)).text();
    expect(revisit).toContain('Payment complete');
  });

  it('shows the decline reason and keeps the form after a declined card', async () => {
    const session = await stripe.checkout.sessions.create(checkoutParams(30_000));
    const response = await postForm(session.url as string, { card: '4000 0000 0000 0002' });
    expect(response.status).toBe(402);
    const html = await response.text();
    expect(html).toMatch(/role="alert"/);
    expect(html).toContain('Your card was declined.');
    expect(html).toContain('card_declined: generic_decline');
    expect(html).toContain('aria-invalid="true"');
    expect(html).toContain('<button type="submit">Pay $300.00</button>');
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');
  });

  it('says an expired session can no longer be paid', async () => {
    const session = await stripe.checkout.sessions.create(checkoutParams(30_000));
    await stripe.checkout.sessions.expire(session.id);
    const page = await fetch(`${fake.url}/checkout/${session.id}`);
    expect(page.status).toBe(410);
    expect(await page.text()).toContain('can no longer be paid');
    const attempt = await postForm(`${fake.url}/checkout/${session.id}`, { card: '4242424242424242' });
    expect(attempt.status).toBe(410);
    expect((await stripe.checkout.sessions.retrieve(session.id)).payment_status).toBe('unpaid');
  });
});

describe('hosted onboarding page', () => {
  it('offers the finish button and sends a used link to refresh_url', async () => {
    const account = await stripe.accounts.create({ type: 'express', email: 'engineer@example.test' });
    const link = await stripe.accountLinks.create({ account: account.id, type: 'account_onboarding', refresh_url: 'http://app.test/payouts/refresh', return_url: 'http://app.test/payouts/done' });
    expect(link.object).toBe('account_link');
    expect(link.expires_at).toBeGreaterThan(link.created);
    const html = await (await fetch(link.url)).text();
    expect(html).toContain('<button type="submit">Finish onboarding (test)</button>');
    expect(html).toContain(account.id);
    const finished = await postForm(link.url, {});
    expect(finished.status).toBe(303);
    expect(finished.headers.get('location')).toBe('http://app.test/payouts/done');
    const reused = await fetch(link.url, { redirect: 'manual' });
    expect(reused.status).toBe(302);
    expect(reused.headers.get('location')).toBe('http://app.test/payouts/refresh');
  });

  it('uses publicUrl for hosted page addresses when given', async () => {
    const temp = tempStateFile();
    const proxied = await startTestFake({ stateFile: temp.file, publicUrl: 'http://payments.local.test:8443/' });
    try {
      const session = await sdkFor(proxied).checkout.sessions.create(checkoutParams(5_000));
      expect(session.url).toBe(`http://payments.local.test:8443/checkout/${session.id}`);
    } finally {
      await proxied.close();
      temp.cleanup();
    }
  });
});
