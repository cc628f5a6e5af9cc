// Helpers for the fake's own tests: a fake on a random port with a fresh state file, an SDK client pointed
// at it, and a webhook receiver that keeps the raw bytes (signatures are over the raw body).
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Stripe from 'stripe';
import { startPaymentsFake, type PaymentsFake, type PaymentsFakeOptions } from './server';

export const TEST_SECRET_KEY = 'sk_test_kitlane_local';
export const TEST_WEBHOOK_SECRET = 'whsec_kitlane_test';

export function tempStateFile(): { file: string; cleanup: () => void } {
  const dir = mkdtempSync(join(tmpdir(), 'payments-fake-'));
  return { file: join(dir, 'state.json'), cleanup: () => rmSync(dir, { recursive: true, force: true }) };
}

export async function startTestFake(overrides: Partial<PaymentsFakeOptions> & { stateFile: string }): Promise<PaymentsFake> {
  return startPaymentsFake({ port: 0, webhookSecret: TEST_WEBHOOK_SECRET, retryBaseMs: 20, ...overrides });
}

export function sdkFor(fake: PaymentsFake, key = TEST_SECRET_KEY): Stripe {
  // Only host, port and protocol differ from production use; retries off so a failing test fails fast.
  return new Stripe(key, { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
}

export interface ReceivedWebhook {
  raw: string;
  signature: string;
}

export interface WebhookReceiver {
  url: string;
  received: ReceivedWebhook[];
  /** Status to answer with for the next N requests (then 200). */
  failNext(count: number, status?: number): void;
  waitFor(count: number, timeoutMs?: number): Promise<ReceivedWebhook[]>;
  close(): Promise<void>;
}

export async function startWebhookReceiver(): Promise<WebhookReceiver> {
  const received: ReceivedWebhook[] = [];
  let failures = 0;
  let failStatus = 500;
  const server: Server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      if (failures > 0) {
        failures -= 1;
        res.writeHead(failStatus).end('failing on purpose');
        return;
      }
      received.push({ raw: Buffer.concat(chunks).toString('utf8'), signature: String(req.headers['stripe-signature'] ?? '') });
      res.writeHead(200, { 'content-type': 'application/json' }).end('{"received":true}');
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as AddressInfo).port;
  return {
    url: `http://127.0.0.1:${port}/webhooks/payments`,
    received,
    failNext(count, status = 500) {
      failures = count;
      failStatus = status;
    },
    async waitFor(count, timeoutMs = 5000) {
      const deadline = Date.now() + timeoutMs;
      while (received.length < count) {
        if (Date.now() > deadline) throw new Error(`expected ${count} webhooks, got ${received.length}`);
        await new Promise((resolve) => setTimeout(resolve, 10));
      }
      return received.slice(0, count);
    },
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}

/** Pays a session through the browserless test control. */
export async function payWithCard(fake: PaymentsFake, sessionId: string, card: string): Promise<{ status: number; body: { ok: boolean; redirect?: string | null; error?: { code: string; decline_code?: string; message: string } } }> {
  const response = await fetch(`${fake.url}/_fake/checkout/${sessionId}/pay`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card }).toString(),
  });
  return { status: response.status, body: (await response.json()) as never };
}

export function checkoutParams(amount: number, currency = 'usd', extra: Partial<Stripe.Checkout.SessionCreateParams> = {}): Stripe.Checkout.SessionCreateParams {
  return {
    mode: 'payment',
    line_items: [{ price_data: { currency, unit_amount: amount, product_data: { name: 'Drum tracking, one song' } }, quantity: 1 }],
    success_url: 'http://app.test/bookings/b1/paid?session={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://app.test/bookings/b1',
    ...extra,
  };
}

/** A paid checkout: returns the session, its PaymentIntent and charge ids. */
export async function paidCheckout(fake: PaymentsFake, stripe: Stripe, amount: number, currency = 'usd', transferGroup = 'booking_b1'): Promise<{ sessionId: string; intentId: string; chargeId: string }> {
  const session = await stripe.checkout.sessions.create(checkoutParams(amount, currency, { payment_intent_data: { transfer_group: transferGroup } }));
  const paid = await payWithCard(fake, session.id, '4242 4242 4242 4242');
  if (!paid.body.ok) throw new Error(`payment failed: ${JSON.stringify(paid.body)}`);
  const intent = await stripe.paymentIntents.retrieve((await stripe.checkout.sessions.retrieve(session.id)).payment_intent as string);
  return { sessionId: session.id, intentId: intent.id, chargeId: intent.latest_charge as string };
}

/** An express account that finished onboarding, so it can receive transfers. */
export async function onboardedAccount(fake: PaymentsFake, stripe: Stripe): Promise<string> {
  const account = await stripe.accounts.create({ type: 'express', email: 'drummer@example.test' });
  const response = await fetch(`${fake.url}/_fake/accounts/${account.id}/complete-onboarding`, { method: 'POST' });
  if (response.status !== 200) throw new Error('onboarding failed');
  return account.id;
}
