import { z } from 'zod';
import { cardError, invalidRequest, noSuch } from './errors';
import { ID_PREFIX, newId } from './ids';
import { checkAmountRange, checkCurrency, checkMinimumCharge } from './money';
import { boolParam, enumParam, expandParam, intParam, listParams, metadataParam, parseParams, stringParam } from './params';
import { PLATFORM, type PaymentsCore } from './core';
import { listBody, newestFirst, render } from './render';
import { TEST_PAYMENT_METHODS, type CardOutcome } from './card-outcomes';
import type { Charge, PaymentError, PaymentIntent, PaymentMethod } from './types';
import type { Route } from './routes-types';

export const paymentIntentCreateInputSchema = z.strictObject({
  amount: intParam,
  currency: z.string(),
  payment_method: z.string().optional(),
  confirm: boolParam.optional(),
  transfer_group: stringParam().optional(),
  metadata: metadataParam.optional(),
  description: stringParam(1000).optional(),
  // The pinned API version (2026-10-28) takes allowed_payment_method_types; older ones payment_method_types.
  allowed_payment_method_types: z.array(z.string()).optional(),
  payment_method_types: z.array(z.string()).optional(),
  automatic_payment_methods: z.strictObject({ enabled: boolParam, allow_redirects: enumParam(['always', 'never']).optional() }).optional(),
  return_url: z.string().optional(),
  capture_method: enumParam(['automatic', 'automatic_async']).optional(),
  receipt_email: z.string().optional(),
  statement_descriptor_suffix: stringParam(22).optional(),
  off_session: boolParam.optional(),
  expand: expandParam,
});
export type PaymentIntentCreateInput = z.output<typeof paymentIntentCreateInputSchema>;

export const paymentIntentConfirmInputSchema = z.strictObject({
  payment_method: z.string().optional(),
  return_url: z.string().optional(),
  off_session: boolParam.optional(),
  expand: expandParam,
});

const paymentIntentListInputSchema = z.strictObject({ ...listParams });
const chargeListInputSchema = z.strictObject({ ...listParams, payment_intent: z.string().optional(), transfer_group: z.string().optional() });
const retrieveInputSchema = z.strictObject({ expand: expandParam, client_secret: z.string().optional() });

export function getPaymentIntent(core: PaymentsCore, id: string): PaymentIntent {
  const intent = core.state.paymentIntents[id];
  if (!intent) throw noSuch('payment_intent', id);
  return intent;
}

export function getCharge(core: PaymentsCore, id: string, param = 'id'): Charge {
  const charge = core.state.charges[id];
  if (!charge) throw noSuch('charge', id, param);
  return charge;
}

/** Builds a PaymentIntent without attempting payment (shared by the API and hosted checkout). */
export function newPaymentIntent(
  core: PaymentsCore,
  fields: { amount: number; currency: string; transfer_group: string | null; metadata: Record<string, string>; description: string | null; allowed_payment_method_types: string[] | null },
): PaymentIntent {
  const id = newId(ID_PREFIX.paymentIntent);
  const intent: PaymentIntent = {
    id,
    object: 'payment_intent',
    allowed_payment_method_types: fields.allowed_payment_method_types,
    amount: fields.amount,
    amount_capturable: 0,
    amount_received: 0,
    capture_method: 'automatic',
    client_secret: `${id}_secret_${newId('', 24)}`,
    confirmation_method: 'automatic',
    created: core.now(),
    currency: fields.currency,
    description: fields.description,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    metadata: fields.metadata,
    payment_method: null,
    // Only cards exist in this fake, so whatever was allowed, card is what is offered.
    payment_method_types: ['card'],
    status: 'requires_payment_method',
    transfer_group: fields.transfer_group,
  };
  core.state.paymentIntents[id] = intent;
  return intent;
}

/** A PaymentMethod object for a test card (server-side token or a number typed on the hosted page). */
export function newCardPaymentMethod(core: PaymentsCore, last4: string): PaymentMethod {
  const method: PaymentMethod = {
    id: newId(ID_PREFIX.paymentMethod),
    object: 'payment_method',
    type: 'card',
    // Brand is left "unknown": the fake does not model card networks.
    card: { brand: 'unknown', last4, exp_month: 12, exp_year: new Date().getUTCFullYear() + 3, funding: 'credit', country: 'US' },
    created: core.now(),
    livemode: false,
    metadata: {},
  };
  core.state.paymentMethods[method.id] = method;
  return method;
}

export type AttemptResult = { ok: true; charge: Charge } | { ok: false; charge: Charge; error: PaymentError };

/**
 * One payment attempt: writes the charge (succeeded or failed), moves the money on success and emits the
 * events the hosted service sends (charge.* then payment_intent.*).
 */
export function attemptPayment(core: PaymentsCore, intent: PaymentIntent, method: PaymentMethod, outcome: CardOutcome): AttemptResult {
  const charge: Charge = {
    id: newId(ID_PREFIX.charge),
    object: 'charge',
    amount: intent.amount,
    amount_captured: outcome.ok ? intent.amount : 0,
    amount_refunded: 0,
    balance_transaction: null,
    captured: outcome.ok,
    created: core.now(),
    currency: intent.currency,
    description: intent.description,
    failure_code: outcome.ok ? null : outcome.code,
    failure_message: outcome.ok ? null : outcome.message,
    livemode: false,
    metadata: { ...intent.metadata },
    outcome: outcome.ok
      ? { network_status: 'approved_by_network', reason: null, risk_level: 'normal', seller_message: 'Payment complete.', type: 'authorized' }
      : {
          network_status: 'declined_by_network',
          reason: outcome.decline_code ?? outcome.code,
          risk_level: 'normal',
          seller_message: 'The bank did not return any further details with this decline.',
          type: 'issuer_declined',
        },
    paid: outcome.ok,
    payment_intent: intent.id,
    payment_method: method.id,
    payment_method_details: { type: 'card', card: { ...method.card } },
    refunded: false,
    status: outcome.ok ? 'succeeded' : 'failed',
    transfer_group: intent.transfer_group,
  };
  core.state.charges[charge.id] = charge;
  intent.latest_charge = charge.id;

  if (outcome.ok) {
    charge.balance_transaction = core.recordMovement(PLATFORM, { amount: charge.amount, currency: charge.currency, type: 'charge', source: charge.id, description: charge.description });
    intent.status = 'succeeded';
    intent.amount_received = intent.amount;
    intent.payment_method = method.id;
    intent.last_payment_error = null;
    core.emit('charge.succeeded', charge);
    core.emit('payment_intent.succeeded', intent);
    return { ok: true, charge };
  }

  const error: PaymentError = {
    type: 'card_error',
    code: outcome.code,
    ...(outcome.decline_code ? { decline_code: outcome.decline_code } : {}),
    message: outcome.message,
    charge: charge.id,
    payment_method: method,
  };
  // After a failed attempt the hosted service detaches the method and asks for a new one.
  intent.status = 'requires_payment_method';
  intent.payment_method = null;
  intent.last_payment_error = error;
  core.emit('charge.failed', charge);
  core.emit('payment_intent.payment_failed', intent);
  return { ok: false, charge, error };
}

function resolveServerSidePaymentMethod(core: PaymentsCore, id: string): { method: PaymentMethod; outcome: CardOutcome } {
  const test = TEST_PAYMENT_METHODS[id];
  if (test) return { method: newCardPaymentMethod(core, test.last4), outcome: test.outcome };
  // Only the documented test tokens: a stored method's card outcome is not kept, so reusing one is refused.
  throw noSuch('PaymentMethod', id, 'payment_method');
}

/** Payment method types a request allows; only card can be paid here, so a list without it is refused. */
export function allowedTypes(input: { allowed_payment_method_types?: string[]; payment_method_types?: string[] }, param: string): string[] | null {
  const list = input.allowed_payment_method_types ?? input.payment_method_types;
  if (list === undefined) return null;
  if (!list.includes('card')) {
    throw invalidRequest(`This fake can take card payments only; include "card" in ${param}.`, { code: 'parameter_invalid', param });
  }
  return list;
}

/**
 * Since API version 2023-08-16 (from memory), a PaymentIntent without an explicit method list uses automatic
 * payment methods, and confirming it needs a return_url unless redirects are turned off or only cards are
 * allowed. Enforcing it here keeps code written against the fake valid against the hosted service.
 */
function requireReturnUrlRule(allowed: string[] | null, input: { automatic_payment_methods?: { enabled: boolean; allow_redirects?: string }; return_url?: string }): void {
  if (allowed !== null && allowed.every((type) => type === 'card')) return;
  if (input.automatic_payment_methods?.allow_redirects === 'never') return;
  if (input.return_url) return;
  throw invalidRequest(
    'This PaymentIntent is configured to accept automatic payment methods. Because some of them might redirect your customer off your page, you must provide a `return_url`. If you do not want redirect-based methods, set `allowed_payment_method_types[]=card` or `automatic_payment_methods[allow_redirects]=never`.',
    { param: 'return_url' },
  );
}

function confirmWith(core: PaymentsCore, intent: PaymentIntent, paymentMethodId: string, expand: string[] | undefined): Record<string, unknown> {
  const { method, outcome } = resolveServerSidePaymentMethod(core, paymentMethodId);
  const result = attemptPayment(core, intent, method, outcome);
  if (!result.ok) {
    throw cardError({
      code: result.error.code,
      ...(result.error.decline_code ? { decline_code: result.error.decline_code } : {}),
      message: result.error.message,
      charge: result.charge.id,
      payment_intent: render(core, intent),
      payment_method: method,
    });
  }
  return render(core, intent, expand);
}

function createPaymentIntent(core: PaymentsCore, raw: Parameters<Route['handle']>[1]): unknown {
  const input = parseParams(paymentIntentCreateInputSchema, raw.params);
  const currency = checkCurrency(input.currency, core.config.minimums);
  checkAmountRange(input.amount, currency);
  checkMinimumCharge(input.amount, currency, core.config.minimums);
  const allowed = allowedTypes(input, input.allowed_payment_method_types ? 'allowed_payment_method_types' : 'payment_method_types');
  if (input.confirm) {
    if (!input.payment_method) {
      throw invalidRequest("You cannot confirm this PaymentIntent because it's missing a payment method. Update it with a payment_method and confirm again.", {
        code: 'payment_intent_unexpected_state',
        param: 'payment_method',
      });
    }
    requireReturnUrlRule(allowed, input);
  }
  if (input.payment_method && !TEST_PAYMENT_METHODS[input.payment_method]) {
    throw noSuch('PaymentMethod', input.payment_method, 'payment_method');
  }
  const intent = newPaymentIntent(core, {
    amount: input.amount,
    currency,
    transfer_group: input.transfer_group ?? null,
    metadata: input.metadata ?? {},
    description: input.description ?? null,
    allowed_payment_method_types: allowed,
  });
  if (input.confirm && input.payment_method) return confirmWith(core, intent, input.payment_method, input.expand);
  if (input.payment_method) {
    // Remembered for a later confirm without parameters.
    intent.payment_method = input.payment_method;
    intent.status = 'requires_confirmation';
  }
  return render(core, intent, input.expand);
}

function confirmPaymentIntent(core: PaymentsCore, raw: Parameters<Route['handle']>[1]): unknown {
  const input = parseParams(paymentIntentConfirmInputSchema, raw.params);
  const intent = getPaymentIntent(core, raw.path.id);
  if (intent.status !== 'requires_payment_method' && intent.status !== 'requires_confirmation') {
    throw invalidRequest(`You cannot confirm this PaymentIntent because it has a status of ${intent.status}.`, { code: 'payment_intent_unexpected_state' });
  }
  const paymentMethod = input.payment_method ?? intent.payment_method;
  if (!paymentMethod) {
    throw invalidRequest("You cannot confirm this PaymentIntent because it's missing a payment method.", { code: 'payment_intent_unexpected_state', param: 'payment_method' });
  }
  return confirmWith(core, intent, paymentMethod, input.expand);
}

export const paymentIntentRoutes: Route[] = [
  { method: 'POST', pattern: '/v1/payment_intents', handle: createPaymentIntent },
  {
    method: 'GET',
    pattern: '/v1/payment_intents',
    handle: (core, req) => listBody(core, newestFirst(core.state.paymentIntents), parseParams(paymentIntentListInputSchema, req.params), '/v1/payment_intents'),
  },
  {
    method: 'GET',
    pattern: '/v1/payment_intents/:id',
    handle: (core, req) => render(core, getPaymentIntent(core, req.path.id), parseParams(retrieveInputSchema, req.params).expand),
  },
  { method: 'POST', pattern: '/v1/payment_intents/:id/confirm', handle: confirmPaymentIntent },
  {
    method: 'GET',
    pattern: '/v1/charges',
    handle: (core, req) => {
      const input = parseParams(chargeListInputSchema, req.params);
      const items = newestFirst(
        core.state.charges,
        (c) => (input.payment_intent === undefined || c.payment_intent === input.payment_intent) && (input.transfer_group === undefined || c.transfer_group === input.transfer_group),
      );
      return listBody(core, items, input, '/v1/charges');
    },
  },
  {
    method: 'GET',
    pattern: '/v1/charges/:id',
    handle: (core, req) => render(core, getCharge(core, req.path.id), parseParams(retrieveInputSchema, req.params).expand),
  },
  {
    method: 'GET',
    pattern: '/v1/payment_methods/:id',
    handle: (core, req) => {
      const method = core.state.paymentMethods[req.path.id];
      if (!method) throw noSuch('PaymentMethod', req.path.id);
      return render(core, method, parseParams(retrieveInputSchema, req.params).expand);
    },
  },
];
