import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import type { PaymentsFake } from './server';
import { orderForMode, retryDelayMs, signatureHeader } from './webhooks';
import {
  TEST_WEBHOOK_SECRET,
  checkoutParams,
  paidCheckout,
  payWithCard,
  sdkFor,
  startTestFake,
  startWebhookReceiver,
  tempStateFile,
  type WebhookReceiver,
} from './test-support';
import type { StripeEvent } from './types';

const verifier = new Stripe('sk_test_verifier_only');

describe('signature scheme', () => {
  it('produces a header the SDK accepts for the raw body and rejects for a changed body', () => {
    // REFERENCES.md: t=<unix>,v1=<hex HMAC-SHA256(secret, "<t>.<raw body>")>, checked with the SDK itself.
    const payload = JSON.stringify({ id: 'evt_1', object: 'event', type: 'charge.succeeded', data: { object: {} } });
    const header = signatureHeader(TEST_WEBHOOK_SECRET, payload, Math.floor(Date.now() / 1000));
    expect(verifier.webhooks.constructEvent(payload, header, TEST_WEBHOOK_SECRET).id).toBe('evt_1');
    expect(() => verifier.webhooks.constructEvent(payload.replace('evt_1', 'evt_2'), header, TEST_WEBHOOK_SECRET)).toThrow(/signature/i);
  });

  it('backs off by doubling from the base delay', () => {
    expect([1, 2, 3, 4].map((n) => retryDelayMs(100, n))).toEqual([100, 200, 400, 800]);
  });

  it('orders one action’s events for each mode', () => {
    const events = ['a', 'b', 'c'].map((type) => ({ id: type, type }) as StripeEvent);
    expect(orderForMode(events, 'normal').map((e) => e.id)).toEqual(['a', 'b', 'c']);
    expect(orderForMode(events, 'reverse').map((e) => e.id)).toEqual(['c', 'b', 'a']);
    expect(orderForMode(events, 'twice').map((e) => e.id)).toEqual(['a', 'a', 'b', 'b', 'c', 'c']);
  });
});

describe('webhook delivery', () => {
  let fake: PaymentsFake;
  let stripe: Stripe;
  let receiver: WebhookReceiver;
  let cleanup: () => void;
  let stateFile: string;

  beforeEach(async () => {
    const temp = tempStateFile();
    cleanup = temp.cleanup;
    stateFile = temp.file;
    receiver = await startWebhookReceiver();
    fake = await startTestFake({ stateFile, webhookUrl: receiver.url });
    stripe = sdkFor(fake);
  });

  afterEach(async () => {
    await fake.close();
    await receiver.close();
    cleanup();
  });

  function verified(received: { raw: string; signature: string }): Stripe.Event {
    return verifier.webhooks.constructEvent(received.raw, received.signature, TEST_WEBHOOK_SECRET);
  }

  async function setMode(mode: string): Promise<void> {
    const response = await fetch(`${fake.url}/_fake/webhooks/mode`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ mode }) });
    expect(response.status).toBe(200);
  }

  it('delivers signed events of a paid checkout that verify with constructEvent', async () => {
    const { sessionId, intentId } = await paidCheckout(fake, stripe, 12_000, 'usd', 'booking_w1');
    const events = (await receiver.waitFor(3)).map(verified);
    expect(events.map((e) => e.type)).toEqual(['charge.succeeded', 'payment_intent.succeeded', 'checkout.session.completed']);
    const completed = events[2];
    expect(completed.object).toBe('event');
    expect(completed.livemode).toBe(false);
    expect(typeof completed.api_version).toBe('string');
    const session = completed.data.object as Stripe.Checkout.Session;
    expect(session.id).toBe(sessionId);
    expect(session.payment_intent).toBe(intentId);
    expect(session.payment_status).toBe('paid');
  });

  it('retries with back-off after a failing receiver until it answers 2xx', async () => {
    receiver.failNext(3);
    const session = await stripe.checkout.sessions.create(checkoutParams(5_000));
    await stripe.checkout.sessions.expire(session.id);
    const [delivered] = await receiver.waitFor(1);
    expect(verified(delivered).type).toBe('checkout.session.expired');
    const deliveries = (await (await fetch(`${fake.url}/_fake/webhooks/deliveries`)).json()) as { data: Array<{ status: string; attempts: number; last_status: number }> };
    expect(deliveries.data).toHaveLength(1);
    expect(deliveries.data[0]).toMatchObject({ status: 'delivered', attempts: 4, last_status: 200 });
  });

  it('retries when the receiver is not listening at all', async () => {
    await receiver.close();
    fake.setWebhookUrl('http://127.0.0.1:9/nothing-listens-here');
    const session = await stripe.checkout.sessions.create(checkoutParams(5_000));
    await stripe.checkout.sessions.expire(session.id);
    const deadline = Date.now() + 3000;
    let attempts = 0;
    while (Date.now() < deadline && attempts < 2) {
      const body = (await (await fetch(`${fake.url}/_fake/webhooks/deliveries`)).json()) as { data: Array<{ attempts: number; last_error: string | null }> };
      attempts = body.data[0]?.attempts ?? 0;
      if (attempts >= 2) expect(body.data[0].last_error).toBeTruthy();
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
    expect(attempts).toBeGreaterThanOrEqual(2);
    receiver = await startWebhookReceiver();
    fake.setWebhookUrl(receiver.url);
    // Pointing at a live receiver starts delivery; flush waits for it and attempts whatever is still pending.
    const flushed = (await (await fetch(`${fake.url}/_fake/webhooks/flush`, { method: 'POST' })).json()) as { pending: number };
    expect(flushed.pending).toBe(0);
    const [delivered] = await receiver.waitFor(1);
    expect(verified(delivered).type).toBe('checkout.session.expired');
  });

  it("delivers every event twice in 'twice' mode with the same event id", async () => {
    await setMode('twice');
    const session = await stripe.checkout.sessions.create(checkoutParams(5_000));
    await stripe.checkout.sessions.expire(session.id);
    const events = (await receiver.waitFor(2)).map(verified);
    expect(events.map((e) => e.type)).toEqual(['checkout.session.expired', 'checkout.session.expired']);
    expect(events[0].id).toBe(events[1].id);
  });

  it("delivers one action's events last-first in 'reverse' mode", async () => {
    await setMode('reverse');
    const session = await stripe.checkout.sessions.create(checkoutParams(5_000));
    expect((await payWithCard(fake, session.id, '4242424242424242')).body.ok).toBe(true);
    const events = (await receiver.waitFor(3)).map(verified);
    expect(events.map((e) => e.type)).toEqual(['checkout.session.completed', 'payment_intent.succeeded', 'charge.succeeded']);
  });

  it('emits refund, transfer and account events', async () => {
    const { chargeId } = await paidCheckout(fake, stripe, 10_000);
    const account = await stripe.accounts.create({ type: 'express' });
    const link = await stripe.accountLinks.create({ account: account.id, type: 'account_onboarding', refresh_url: 'http://app.test/r', return_url: 'http://app.test/done' });
    await fetch(link.url, { method: 'POST', redirect: 'manual' });
    const refund = await stripe.refunds.create({ charge: chargeId, amount: 1_000 });
    await stripe.refunds.update(refund.id, { metadata: { reason_note: 'changes not needed' } });
    const transfer = await stripe.transfers.create({ amount: 5_000, currency: 'usd', destination: account.id, source_transaction: chargeId });
    await stripe.transfers.createReversal(transfer.id, { amount: 500 });
    const events = (await receiver.waitFor(9)).map(verified);
    expect(events.slice(3).map((e) => e.type)).toEqual(['account.updated', 'refund.created', 'charge.refunded', 'refund.updated', 'transfer.created', 'transfer.reversed']);
    const accountUpdated = events[3];
    expect(accountUpdated.account).toBe(account.id);
    expect((accountUpdated.data.object as Stripe.Account).payouts_enabled).toBe(true);
    expect(accountUpdated.data.previous_attributes).toMatchObject({ payouts_enabled: false });
    expect((events[5].data.object as Stripe.Charge).amount_refunded).toBe(1_000);
    expect((events[8].data.object as Stripe.Transfer).amount_reversed).toBe(500);
  });

  it('keeps pending deliveries across a restart and delivers them afterwards', async () => {
    fake.setWebhookUrl(null);
    await fake.close();
    // Started without a reachable receiver: the delivery stays pending in the state file.
    fake = await startTestFake({ stateFile, webhookUrl: 'http://127.0.0.1:9/down', retryBaseMs: 60_000 });
    stripe = sdkFor(fake);
    const session = await stripe.checkout.sessions.create(checkoutParams(5_000));
    await stripe.checkout.sessions.expire(session.id);
    const deadline = Date.now() + 3000;
    for (;;) {
      const body = (await (await fetch(`${fake.url}/_fake/webhooks/deliveries`)).json()) as { data: Array<{ attempts: number }> };
      if ((body.data[0]?.attempts ?? 0) >= 1 || Date.now() > deadline) break;
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
    await fake.close();
    fake = await startTestFake({ stateFile, webhookUrl: receiver.url });
    stripe = sdkFor(fake);
    await fetch(`${fake.url}/_fake/webhooks/flush`, { method: 'POST' });
    const [delivered] = await receiver.waitFor(1);
    const event = verified(delivered);
    expect(event.type).toBe('checkout.session.expired');
    expect((event.data.object as Stripe.Checkout.Session).id).toBe(session.id);
  });
});
