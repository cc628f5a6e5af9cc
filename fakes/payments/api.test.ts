import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import Stripe from 'stripe';
import type { PaymentsFake } from './server';
import { checkoutParams, onboardedAccount, paidCheckout, payWithCard, sdkFor, startTestFake, tempStateFile } from './test-support';

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

async function rejection(promise: Promise<unknown>): Promise<Stripe.errors.StripeError> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof Stripe.errors.StripeError) return error;
    throw error;
  }
  throw new Error('expected the call to fail');
}

describe('authentication', () => {
  it('refuses a key that is not a secret test key with 401', async () => {
    const error = await rejection(sdkFor(fake, 'sk_live_0000000000000000').balance.retrieve());
    expect(error).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect(error.statusCode).toBe(401);
    expect(error.message).toMatch(/Invalid API Key/);
  });

  it('refuses a request without any key with 401 and the usual error shape', async () => {
    const response = await fetch(`${fake.url}/v1/balance`);
    expect(response.status).toBe(401);
    const body = (await response.json()) as { error: { type: string; message: string } };
    expect(body.error.type).toBe('invalid_request_error');
    expect(body.error.message).toMatch(/did not provide an API key/);
  });
});

describe('checkout sessions', () => {
  it('creates an open session whose url is the hosted page and totals the line items', async () => {
    const session = await stripe.checkout.sessions.create({
      ...checkoutParams(0),
      line_items: [
        { price_data: { currency: 'usd', unit_amount: 25_000, product_data: { name: 'Drum tracking, one song' } }, quantity: 2 },
        { price_data: { currency: 'usd', unit_amount: 4_500, product_data: { name: 'Room and mic package, half day' } }, quantity: 1 },
      ],
      metadata: { booking: 'b1' },
      client_reference_id: 'b1',
    });
    expect(session.id).toMatch(/^cs_test_/);
    expect(session.object).toBe('checkout.session');
    expect(session.amount_total).toBe(54_500);
    expect(session.status).toBe('open');
    expect(session.payment_status).toBe('unpaid');
    expect(session.payment_intent).toBeNull();
    expect(session.url).toBe(`${fake.url}/checkout/${session.id}`);
    expect(session.livemode).toBe(false);
    expect(session.metadata).toEqual({ booking: 'b1' });
    expect(session.client_reference_id).toBe('b1');
    const items = await stripe.checkout.sessions.listLineItems(session.id);
    expect(items.data.map((item) => [item.description, item.quantity, item.amount_total])).toEqual([
      ['Drum tracking, one song', 2, 50_000],
      ['Room and mic package, half day', 1, 4_500],
    ]);
  });

  it('completes the session on payment and creates the PaymentIntent and charge with the transfer group', async () => {
    const session = await stripe.checkout.sessions.create(
      checkoutParams(30_000, 'usd', { payment_intent_data: { transfer_group: 'booking_b7', metadata: { booking: 'b7' } } }),
    );
    const paid = await payWithCard(fake, session.id, '4242 4242 4242 4242');
    expect(paid.body).toEqual({ ok: true, redirect: `http://app.test/bookings/b1/paid?session=${session.id}` });

    const after = await stripe.checkout.sessions.retrieve(session.id, { expand: ['payment_intent.latest_charge'] });
    expect(after.status).toBe('complete');
    expect(after.payment_status).toBe('paid');
    const intent = after.payment_intent as Stripe.PaymentIntent;
    expect(intent.id).toMatch(/^pi_/);
    expect(intent.status).toBe('succeeded');
    expect(intent.amount).toBe(30_000);
    expect(intent.transfer_group).toBe('booking_b7');
    expect(intent.metadata).toEqual({ booking: 'b7' });
    const charge = await stripe.charges.retrieve((intent.latest_charge as Stripe.Charge).id);
    expect(charge.id).toMatch(/^ch_/);
    expect(charge.status).toBe('succeeded');
    expect(charge.amount).toBe(30_000);
    expect(charge.transfer_group).toBe('booking_b7');
    expect(charge.balance_transaction).toMatch(/^txn_/);
  });

  it('expires an open session and then refuses payment on it', async () => {
    const session = await stripe.checkout.sessions.create(checkoutParams(5_000));
    const expired = await stripe.checkout.sessions.expire(session.id);
    expect(expired.status).toBe('expired');
    expect(expired.url).toBeNull();
    const paid = await payWithCard(fake, session.id, '4242424242424242');
    expect(paid.status).toBe(410);
    expect(paid.body.ok).toBe(false);
    const again = await rejection(stripe.checkout.sessions.expire(session.id));
    expect(again.statusCode).toBe(400);
  });

  it('keeps a session payable after a declined card and reuses its PaymentIntent', async () => {
    const session = await stripe.checkout.sessions.create(checkoutParams(8_000));
    const declined = await payWithCard(fake, session.id, '4000 0000 0000 9995');
    expect(declined.body).toMatchObject({ ok: false, error: { code: 'card_declined', decline_code: 'insufficient_funds' } });
    const pending = await stripe.checkout.sessions.retrieve(session.id);
    expect(pending.status).toBe('open');
    const failedIntent = await stripe.paymentIntents.retrieve(pending.payment_intent as string);
    expect(failedIntent.status).toBe('requires_payment_method');
    expect(failedIntent.last_payment_error?.decline_code).toBe('insufficient_funds');

    const paid = await payWithCard(fake, session.id, '4242 4242 4242 4242');
    expect(paid.body.ok).toBe(true);
    const done = await stripe.checkout.sessions.retrieve(session.id);
    expect(done.payment_intent).toBe(failedIntent.id);
  });

  it.each([
    ['4000 0000 0000 0002', 'card_declined', 'generic_decline'],
    ['4000 0000 0000 9987', 'card_declined', 'lost_card'],
    ['4000 0000 0000 0069', 'expired_card', undefined],
    ['1234 5678 9012 3456', 'incorrect_number', undefined],
  ])('answers card %s with %s / %s', async (card, code, declineCode) => {
    const session = await stripe.checkout.sessions.create(checkoutParams(8_000));
    const result = await payWithCard(fake, session.id, card);
    expect(result.status).toBe(402);
    expect(result.body.error?.code).toBe(code);
    expect(result.body.error?.decline_code).toBe(declineCode);
  });

  it('rejects a checkout total below the currency minimum', async () => {
    // REFERENCES.md (Stripe): minimum USD 0.50.
    const error = await rejection(stripe.checkout.sessions.create(checkoutParams(49)));
    expect(error.statusCode).toBe(400);
    expect(error.code).toBe('amount_too_small');
    expect(error.message).toMatch(/at least \$0\.50 usd/);
    await expect(stripe.checkout.sessions.create(checkoutParams(50))).resolves.toMatchObject({ amount_total: 50 });
  });

  it('treats JPY as zero-decimal: 5000 means ¥5,000 and ¥49 is under the minimum', async () => {
    // REFERENCES.md (Stripe): JPY is zero-decimal; minimum ¥50 (public table, from memory).
    const session = await stripe.checkout.sessions.create(checkoutParams(5_000, 'jpy'));
    const page = await (await fetch(session.url as string)).text();
    expect(page).toContain('¥5,000');
    expect(page).not.toContain('¥50.00');
    const error = await rejection(stripe.checkout.sessions.create(checkoutParams(49, 'jpy')));
    expect(error.code).toBe('amount_too_small');
  });

  it('rejects amounts with more than eight digits and unknown parameters', async () => {
    const tooLarge = await rejection(stripe.paymentIntents.create({ amount: 100_000_000, currency: 'usd', allowed_payment_method_types: ['card'] }));
    expect(tooLarge.code).toBe('amount_too_large');
    const unknown = await rejection(stripe.checkout.sessions.create({ ...checkoutParams(5_000), colour: 'red' } as Stripe.Checkout.SessionCreateParams));
    expect(unknown.code).toBe('parameter_unknown');
    expect(unknown.param).toBe('colour');
    const missing = await rejection(stripe.transfers.create({ currency: 'usd', destination: 'acct_x' } as Stripe.TransferCreateParams));
    expect(missing.code).toBe('parameter_missing');
    expect(missing.param).toBe('amount');
  });

  it('answers 404 resource_missing for an unknown id', async () => {
    const error = await rejection(stripe.checkout.sessions.retrieve('cs_test_nothing'));
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(error.statusCode).toBe(404);
    expect(error.code).toBe('resource_missing');
  });
});

describe('payment intents with server-side test payment methods', () => {
  it('succeeds with pm_card_visa and credits the platform balance', async () => {
    const intent = await stripe.paymentIntents.create({ amount: 2_000, currency: 'usd', confirm: true, payment_method: 'pm_card_visa', allowed_payment_method_types: ['card'] });
    expect(intent.status).toBe('succeeded');
    expect(intent.amount_received).toBe(2_000);
    const balance = await stripe.balance.retrieve();
    expect(balance.available).toEqual([{ amount: 2_000, currency: 'usd', source_types: { card: 2_000 } }]);
  });

  it.each([
    ['pm_card_visa_chargeDeclined', 'card_declined', 'generic_decline'],
    ['pm_card_visa_chargeDeclinedInsufficientFunds', 'card_declined', 'insufficient_funds'],
    ['pm_card_visa_chargeDeclinedLostCard', 'card_declined', 'lost_card'],
    ['pm_card_chargeDeclinedExpiredCard', 'expired_card', undefined],
  ])('declines %s with 402 %s / %s and leaves the money where it was', async (paymentMethod, code, declineCode) => {
    const error = await rejection(stripe.paymentIntents.create({ amount: 2_000, currency: 'usd', confirm: true, payment_method: paymentMethod, allowed_payment_method_types: ['card'] }));
    expect(error).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(error.statusCode).toBe(402);
    expect(error.code).toBe(code);
    // The SDK turns a missing decline_code into ''; the wire body leaves it out.
    expect((error.raw as { decline_code?: string }).decline_code).toBe(declineCode);
    const intentId = (error.raw as { payment_intent?: { id: string } }).payment_intent?.id as string;
    const intent = await stripe.paymentIntents.retrieve(intentId);
    expect(intent.status).toBe('requires_payment_method');
    const charge = await stripe.charges.retrieve(intent.latest_charge as string);
    expect(charge.status).toBe('failed');
    expect(charge.failure_code).toBe(code);
    const balance = await stripe.balance.retrieve();
    expect(balance.available[0].amount).toBe(0);
  });

  it('requires a return_url when confirming with automatic payment methods', async () => {
    const error = await rejection(stripe.paymentIntents.create({ amount: 2_000, currency: 'usd', confirm: true, payment_method: 'pm_card_visa' }));
    expect(error.statusCode).toBe(400);
    expect(error.param).toBe('return_url');
  });
});

describe('refunds', () => {
  it('refunds partially and repeatedly up to the charge, then refuses more', async () => {
    const { chargeId, intentId } = await paidCheckout(fake, stripe, 10_000);
    const first = await stripe.refunds.create({ charge: chargeId, amount: 3_000 });
    expect(first.id).toMatch(/^re_/);
    expect(first.status).toBe('succeeded');
    await stripe.refunds.create({ payment_intent: intentId, amount: 5_000 });
    const tooMuch = await rejection(stripe.refunds.create({ charge: chargeId, amount: 2_001 }));
    expect(tooMuch.statusCode).toBe(400);
    expect(tooMuch.code).toBe('amount_too_large');
    expect(tooMuch.message).toMatch(/greater than unrefunded amount on charge \(\$20\.00\)/);
    const rest = await stripe.refunds.create({ charge: chargeId });
    expect(rest.amount).toBe(2_000);
    const charge = await stripe.charges.retrieve(chargeId, { expand: ['refunds'] });
    expect(charge.amount_refunded).toBe(10_000);
    expect(charge.refunded).toBe(true);
    expect(charge.refunds?.data.map((r) => r.amount)).toEqual([2_000, 5_000, 3_000]);
    const again = await rejection(stripe.refunds.create({ charge: chargeId, amount: 1 }));
    expect(again.code).toBe('charge_already_refunded');
    expect((await stripe.balance.retrieve()).available[0].amount).toBe(0);
  });
});

describe('connected accounts and transfers', () => {
  it('creates an express account that cannot be paid until onboarding is finished', async () => {
    const account = await stripe.accounts.create({ type: 'express', email: 'drummer@example.test' });
    expect(account.id).toMatch(/^acct_/);
    expect([account.charges_enabled, account.payouts_enabled, account.details_submitted]).toEqual([false, false, false]);
    await paidCheckout(fake, stripe, 10_000);
    const refused = await rejection(stripe.transfers.create({ amount: 1_000, currency: 'usd', destination: account.id }));
    expect(refused.code).toBe('insufficient_capabilities_for_transfer');
    const link = await stripe.accountLinks.create({ account: account.id, type: 'account_onboarding', refresh_url: 'http://app.test/payouts/refresh', return_url: 'http://app.test/payouts/done' });
    expect(link.url).toMatch(new RegExp(`^${fake.url}/onboarding/`));
    const finished = await fetch(link.url, { method: 'POST', redirect: 'manual' });
    expect(finished.status).toBe(303);
    expect(finished.headers.get('location')).toBe('http://app.test/payouts/done');
    const after = await stripe.accounts.retrieve(account.id);
    expect([after.charges_enabled, after.payouts_enabled, after.details_submitted]).toEqual([true, true, true]);
    await expect(stripe.transfers.create({ amount: 1_000, currency: 'usd', destination: account.id })).resolves.toMatchObject({ amount: 1_000 });
  });

  it('moves money from the platform to the connected account and back on reversal', async () => {
    const { chargeId } = await paidCheckout(fake, stripe, 10_000, 'usd', 'booking_b9');
    const drummer = await onboardedAccount(fake, stripe);
    const transfer = await stripe.transfers.create({ amount: 8_500, currency: 'usd', destination: drummer, source_transaction: chargeId, metadata: { booking: 'b9' } });
    expect(transfer.id).toMatch(/^tr_/);
    expect(transfer.transfer_group).toBe('booking_b9');
    expect((await stripe.balance.retrieve()).available[0].amount).toBe(1_500);
    const connected = await stripe.balance.retrieve({}, { stripeAccount: drummer });
    expect(connected.available[0]).toMatchObject({ amount: 8_500, currency: 'usd' });

    const reversal = await stripe.transfers.createReversal(transfer.id, { amount: 2_000 });
    expect(reversal.id).toMatch(/^trr_/);
    expect((await stripe.balance.retrieve()).available[0].amount).toBe(3_500);
    expect((await stripe.balance.retrieve({}, { stripeAccount: drummer })).available[0].amount).toBe(6_500);
    const reversals = await stripe.transfers.listReversals(transfer.id);
    expect(reversals.data.map((r) => r.amount)).toEqual([2_000]);
    const updated = await stripe.transfers.retrieve(transfer.id);
    expect(updated.amount_reversed).toBe(2_000);
    expect(updated.reversed).toBe(false);
    const byGroup = await stripe.transfers.list({ transfer_group: 'booking_b9' });
    expect(byGroup.data.map((t) => t.id)).toEqual([transfer.id]);
    expect(byGroup.object).toBe('list');
    expect(byGroup.has_more).toBe(false);
    expect(byGroup.url).toBe('/v1/transfers');
  });

  it('refuses a transfer larger than what remains of the source charge', async () => {
    const { chargeId } = await paidCheckout(fake, stripe, 10_000);
    await paidCheckout(fake, stripe, 50_000, 'usd', 'booking_other');
    const drummer = await onboardedAccount(fake, stripe);
    await stripe.refunds.create({ charge: chargeId, amount: 2_000 });
    await stripe.transfers.create({ amount: 6_000, currency: 'usd', destination: drummer, source_transaction: chargeId });
    // 10,000 − 2,000 refunded − 6,000 transferred = 2,000 left of this charge, though the platform holds more.
    const error = await rejection(stripe.transfers.create({ amount: 2_001, currency: 'usd', destination: drummer, source_transaction: chargeId }));
    expect(error.statusCode).toBe(400);
    expect(error.code).toBe('balance_insufficient');
    await expect(stripe.transfers.create({ amount: 2_000, currency: 'usd', destination: drummer, source_transaction: chargeId })).resolves.toMatchObject({ amount: 2_000 });
  });

  it('refuses a transfer the platform balance cannot cover', async () => {
    await paidCheckout(fake, stripe, 1_000);
    const drummer = await onboardedAccount(fake, stripe);
    const error = await rejection(stripe.transfers.create({ amount: 1_001, currency: 'usd', destination: drummer }));
    expect(error.code).toBe('balance_insufficient');
    expect((await stripe.balance.retrieve()).available[0].amount).toBe(1_000);
  });

  it('accepts the controller form of an express account', async () => {
    const account = await stripe.accounts.create({ controller: { stripe_dashboard: { type: 'express' } } });
    expect(account.type).toBe('express');
  });

  it('refuses the Stripe-Account header for an account that does not exist', async () => {
    const error = await rejection(stripe.balance.retrieve({}, { stripeAccount: 'acct_missing' }));
    expect(error.statusCode).toBe(403);
  });
});

describe('idempotency', () => {
  it('replays the first response for the same key and parameters', async () => {
    await paidCheckout(fake, stripe, 10_000);
    const drummer = await onboardedAccount(fake, stripe);
    const params = { amount: 4_000, currency: 'usd', destination: drummer, transfer_group: 'booking_b1' };
    const first = await stripe.transfers.create(params, { idempotencyKey: 'release-b1-v1-drummer' });
    const second = await stripe.transfers.create(params, { idempotencyKey: 'release-b1-v1-drummer' });
    expect(second.id).toBe(first.id);
    expect(second.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect((await stripe.transfers.list({ transfer_group: 'booking_b1' })).data).toHaveLength(1);
    expect((await stripe.balance.retrieve()).available[0].amount).toBe(6_000);
  });

  it('answers idempotency_error when the same key comes with other parameters', async () => {
    await stripe.checkout.sessions.create(checkoutParams(5_000), { idempotencyKey: 'pay-b1' });
    const error = await rejection(stripe.checkout.sessions.create(checkoutParams(6_000), { idempotencyKey: 'pay-b1' }));
    expect(error).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect(error.statusCode).toBe(400);
    expect(error.type).toBe('StripeIdempotencyError');
    expect(error.rawType).toBe('idempotency_error');
  });

  it('replays a card decline instead of charging again', async () => {
    const params: Stripe.PaymentIntentCreateParams = { amount: 2_000, currency: 'usd', confirm: true, payment_method: 'pm_card_visa_chargeDeclined', allowed_payment_method_types: ['card'] };
    const first = await rejection(stripe.paymentIntents.create(params, { idempotencyKey: 'decline-once' }));
    const second = await rejection(stripe.paymentIntents.create(params, { idempotencyKey: 'decline-once' }));
    expect(second.statusCode).toBe(402);
    expect(second.charge).toBe(first.charge);
    expect((await stripe.charges.list()).data).toHaveLength(1);
  });
});

describe('expiry over time', () => {
  const DAY_AND_AN_HOUR_MS = 25 * 60 * 60 * 1000;

  it('forgets idempotency keys after 24 hours (REFERENCES.md, Stripe)', async () => {
    await stripe.checkout.sessions.create(checkoutParams(5_000), { idempotencyKey: 'pay-b2' });
    const realNow = Date.now();
    vi.spyOn(Date, 'now').mockReturnValue(realNow + DAY_AND_AN_HOUR_MS);
    try {
      const later = await stripe.checkout.sessions.create(checkoutParams(6_000), { idempotencyKey: 'pay-b2' });
      expect(later.amount_total).toBe(6_000);
    } finally {
      vi.restoreAllMocks();
    }
  });

  it('expires an unpaid session after its expires_at and records checkout.session.expired', async () => {
    const session = await stripe.checkout.sessions.create(checkoutParams(5_000));
    expect(session.expires_at - session.created).toBe(24 * 60 * 60);
    const realNow = Date.now();
    vi.spyOn(Date, 'now').mockReturnValue(realNow + DAY_AND_AN_HOUR_MS);
    try {
      expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('expired');
      const events = await stripe.events.list({ type: 'checkout.session.expired' });
      expect(events.data.map((e) => (e.data.object as Stripe.Checkout.Session).id)).toEqual([session.id]);
    } finally {
      vi.restoreAllMocks();
    }
  });
});

describe('events', () => {
  it('records events of a payment and lists them newest first with a type filter and cursor', async () => {
    const { sessionId } = await paidCheckout(fake, stripe, 7_000);
    const all = await stripe.events.list({ limit: 2 });
    expect(all.data.map((e) => e.type)).toEqual(['checkout.session.completed', 'payment_intent.succeeded']);
    expect(all.has_more).toBe(true);
    const next = await stripe.events.list({ limit: 2, starting_after: all.data[1].id });
    expect(next.data.map((e) => e.type)).toEqual(['charge.succeeded']);
    const completed = await stripe.events.list({ type: 'checkout.session.completed' });
    expect(completed.data).toHaveLength(1);
    const event = await stripe.events.retrieve(completed.data[0].id);
    expect(event.id).toMatch(/^evt_/);
    expect((event.data.object as Stripe.Checkout.Session).id).toBe(sessionId);
    const charges = await stripe.events.list({ type: 'charge.*' });
    expect(charges.data.map((e) => e.type)).toEqual(['charge.succeeded']);
  });
});
