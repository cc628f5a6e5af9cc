// The processor's webhooks: verified with the SDK's own constructEvent over the raw bytes, handled once per
// event id, and always by reading the processor's current state, so a repeated or late event changes
// nothing (REFERENCES.md, Payments: "dedupe on event.id and read current state").
import type Stripe from 'stripe';
import type { AppContext } from '../../app';
import { AppError } from '../../http/app-error';
import { paymentsRepo as repo } from './payments.repository';
import { escrowFor } from './escrow.service';
import { createPayoutAccounts } from './payout-accounts.service';

function verify(ctx: AppContext, raw: unknown, signature: string | undefined): Stripe.Event {
  if (!Buffer.isBuffer(raw) || !signature) throw new AppError('bad_signature', 'A signed webhook body is required', 400);
  try {
    return ctx.stripe.webhooks.constructEvent(raw, signature, ctx.env.STRIPE_WEBHOOK_SECRET);
  } catch (error) {
    throw new AppError('bad_signature', `The webhook signature does not verify: ${(error as Error).message}`, 400);
  }
}

function declineReason(intent: Stripe.PaymentIntent): string {
  const error = intent.last_payment_error;
  if (!error) return 'The card was declined';
  return [error.message?.replace(/\.$/, ''), error.decline_code ? `(${error.decline_code})` : error.code ? `(${error.code})` : ''].filter(Boolean).join(' ');
}

async function handle(ctx: AppContext, event: Stripe.Event): Promise<void> {
  const escrow = escrowFor(ctx);
  switch (event.type) {
    case 'checkout.session.completed':
    case 'checkout.session.async_payment_succeeded':
    case 'checkout.session.expired':
      await escrow.syncCheckoutSession(event.data.object.id);
      return;
    case 'payment_intent.payment_failed': {
      const paymentId = event.data.object.metadata?.paymentId;
      if (!paymentId) return;
      // Current state: a later successful attempt must not be shown as declined.
      const intent = await ctx.stripe.paymentIntents.retrieve(event.data.object.id);
      if (intent.status !== 'succeeded') escrow.recordDecline(paymentId, declineReason(intent));
      return;
    }
    case 'account.updated':
      await createPayoutAccounts(ctx).refreshByStripeId(event.data.object.id);
      return;
    default:
      // Refunds, transfers and charges are recorded from our own calls' answers; their events need nothing.
      return;
  }
}

/** Verifies, dedupes and handles one delivery. A failure answers 5xx so the processor retries it. */
export async function receiveWebhook(ctx: AppContext, raw: unknown, signature: string | undefined): Promise<{ received: true; duplicate: boolean }> {
  const event = verify(ctx, raw, signature);
  if (repo.wasProcessed(ctx.db, event.id)) return { received: true, duplicate: true };
  try {
    await handle(ctx, event);
  } catch (error) {
    if (error instanceof AppError) throw error;
    // Not processed: 503 makes the processor deliver it again later.
    throw new AppError('webhook_retry', `Could not handle ${event.type} now: ${(error as Error).message}`, 503);
  }
  repo.markProcessed(ctx.db, event.id, event.type);
  return { received: true, duplicate: false };
}
