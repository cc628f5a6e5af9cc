import { z } from 'zod';
import { invalidRequest, noSuch } from './errors';
import { ID_PREFIX, newId } from './ids';
import { checkAmountRange, checkCurrency, checkMinimumCharge, formatAmount } from './money';
import { enumParam, expandParam, intParam, listParams, metadataParam, parseParams, stringParam } from './params';
import type { PaymentsCore } from './core';
import { listBody, newestFirst, paginate, render } from './render';
import { allowedTypes, attemptPayment, newCardPaymentMethod, newPaymentIntent } from './payment-intents';
import { normaliseCardNumber, outcomeForCardNumber } from './card-outcomes';
import type { CheckoutLineItem, CheckoutSession } from './types';
import type { Route } from './routes-types';

const lineItemInputSchema = z.strictObject({
  price_data: z.strictObject({
    currency: z.string(),
    unit_amount: intParam,
    product_data: z.strictObject({
      name: stringParam(250),
      description: stringParam(1000).optional(),
      metadata: metadataParam.optional(),
      images: z.array(z.string()).optional(),
    }),
    tax_behavior: enumParam(['exclusive', 'inclusive', 'unspecified']).optional(),
  }),
  quantity: intParam,
});

export const checkoutSessionCreateInputSchema = z.strictObject({
  mode: enumParam(['payment', 'setup', 'subscription']),
  line_items: z.array(lineItemInputSchema),
  success_url: z.string().optional(),
  cancel_url: z.string().optional(),
  metadata: metadataParam.optional(),
  client_reference_id: stringParam(200).optional(),
  customer_email: z.string().optional(),
  expires_at: intParam.optional(),
  allowed_payment_method_types: z.array(z.string()).optional(),
  payment_method_types: z.array(z.string()).optional(),
  locale: z.string().optional(),
  submit_type: enumParam(['auto', 'book', 'donate', 'pay']).optional(),
  payment_intent_data: z
    .strictObject({
      transfer_group: stringParam().optional(),
      metadata: metadataParam.optional(),
      description: stringParam(1000).optional(),
      receipt_email: z.string().optional(),
    })
    .optional(),
  expand: expandParam,
});
export type CheckoutSessionCreateInput = z.output<typeof checkoutSessionCreateInputSchema>;

const sessionListInputSchema = z.strictObject({
  ...listParams,
  payment_intent: z.string().optional(),
  status: enumParam(['open', 'complete', 'expired']).optional(),
});
const retrieveInputSchema = z.strictObject({ expand: expandParam });
const expireInputSchema = z.strictObject({ expand: expandParam });
const lineItemListInputSchema = z.strictObject({ ...listParams });

/** Public reference (from memory): a session lives 24 hours by default; expires_at may be 30 min to 24 h ahead. */
const DEFAULT_LIFETIME_S = 24 * 60 * 60;
const MIN_LIFETIME_S = 30 * 60;

export function checkoutPageUrl(core: PaymentsCore, sessionId: string): string {
  return `${core.config.baseUrl()}/checkout/${sessionId}`;
}

export function getSession(core: PaymentsCore, id: string): CheckoutSession {
  expireDueSessions(core);
  const session = core.state.checkoutSessions[id];
  if (!session) throw noSuch('checkout.session', id);
  return session;
}

function buildLineItems(core: PaymentsCore, input: CheckoutSessionCreateInput): { items: CheckoutLineItem[]; currency: string } {
  if (input.line_items.length === 0) throw invalidRequest('line_items must contain at least one item in payment mode.', { code: 'parameter_missing', param: 'line_items' });
  const first = input.line_items[0].price_data.currency;
  const currency = checkCurrency(first, core.config.minimums, 'line_items[0][price_data][currency]');
  const created = core.now();
  const items = input.line_items.map((line, index): CheckoutLineItem => {
    const lineCurrency = checkCurrency(line.price_data.currency, core.config.minimums, `line_items[${index}][price_data][currency]`);
    if (lineCurrency !== currency) {
      throw invalidRequest('All line items must use the same currency.', { param: `line_items[${index}][price_data][currency]` });
    }
    if (line.quantity < 1) throw invalidRequest('Quantity must be at least 1.', { code: 'parameter_invalid_integer', param: `line_items[${index}][quantity]` });
    if (line.price_data.unit_amount < 0) {
      throw invalidRequest('This value must be greater than or equal to 0.', { code: 'parameter_invalid_integer', param: `line_items[${index}][price_data][unit_amount]` });
    }
    const subtotal = line.price_data.unit_amount * line.quantity;
    return {
      id: newId(ID_PREFIX.lineItem),
      object: 'item',
      amount_discount: 0,
      amount_subtotal: subtotal,
      amount_tax: 0,
      amount_total: subtotal,
      currency,
      description: line.price_data.product_data.name,
      quantity: line.quantity,
      price: {
        id: newId(ID_PREFIX.price),
        object: 'price',
        active: false,
        currency,
        product: newId(ID_PREFIX.product, 14),
        type: 'one_time',
        unit_amount: line.price_data.unit_amount,
        unit_amount_decimal: String(line.price_data.unit_amount),
        livemode: false,
        created,
        metadata: {},
      },
    };
  });
  return { items, currency };
}

function sessionExpiry(core: PaymentsCore, requested: number | undefined): number {
  const now = core.now();
  if (requested === undefined) return now + DEFAULT_LIFETIME_S;
  if (requested < now + MIN_LIFETIME_S || requested > now + DEFAULT_LIFETIME_S) {
    throw invalidRequest('The `expires_at` timestamp must be between 30 minutes and 24 hours from Checkout Session creation.', { param: 'expires_at' });
  }
  return requested;
}

function createCheckoutSession(core: PaymentsCore, params: Parameters<Route['handle']>[1]['params']): unknown {
  const input = parseParams(checkoutSessionCreateInputSchema, params);
  if (input.mode !== 'payment') throw invalidRequest(`This fake supports only mode=payment (got ${input.mode}).`, { param: 'mode' });
  const { items, currency } = buildLineItems(core, input);
  const total = items.reduce((sum, item) => sum + item.amount_total, 0);
  checkAmountRange(total, currency, 'line_items');
  try {
    checkMinimumCharge(total, currency, core.config.minimums, 'line_items');
  } catch {
    const minimum = core.config.minimums[currency] ?? 1;
    throw invalidRequest(`The Checkout Session's total amount due must add up to at least ${formatAmount(minimum, currency)} ${currency}`, {
      code: 'amount_too_small',
      param: 'line_items',
    });
  }
  const allowed = allowedTypes(input, input.allowed_payment_method_types ? 'allowed_payment_method_types' : 'payment_method_types');
  const id = newId(ID_PREFIX.checkoutSession, 58);
  const session: CheckoutSession = {
    id,
    object: 'checkout.session',
    allowed_payment_method_types: allowed,
    amount_subtotal: total,
    amount_total: total,
    cancel_url: input.cancel_url ?? null,
    client_reference_id: input.client_reference_id ?? null,
    created: core.now(),
    currency,
    customer: null,
    customer_details: null,
    customer_email: input.customer_email ?? null,
    expires_at: sessionExpiry(core, input.expires_at),
    livemode: false,
    metadata: input.metadata ?? {},
    mode: 'payment',
    payment_intent: null,
    payment_method_types: ['card'],
    payment_status: 'unpaid',
    status: 'open',
    success_url: input.success_url ?? null,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: 'hosted',
    url: checkoutPageUrl(core, id),
  };
  core.state.checkoutSessions[id] = session;
  core.state.sessionLineItems[id] = items;
  core.state.sessionIntentData[id] = {
    transfer_group: input.payment_intent_data?.transfer_group ?? null,
    metadata: input.payment_intent_data?.metadata ?? {},
    description: input.payment_intent_data?.description ?? null,
  };
  return render(core, session, input.expand);
}

function markExpired(core: PaymentsCore, session: CheckoutSession): void {
  session.status = 'expired';
  session.url = null;
  core.emit('checkout.session.expired', session);
}

/** Sessions past expires_at expire (with their event) the next time anything looks at sessions. */
export function expireDueSessions(core: PaymentsCore): void {
  const now = core.now();
  const due = Object.values(core.state.checkoutSessions).filter((s) => s.status === 'open' && s.expires_at <= now);
  if (due.length === 0) return;
  core.action({ requestId: null, idempotencyKey: null, apiVersion: null }, () => {
    for (const session of due) markExpired(core, session);
  });
}

function expireSession(core: PaymentsCore, req: Parameters<Route['handle']>[1]): unknown {
  const input = parseParams(expireInputSchema, req.params);
  const session = getSession(core, req.path.id);
  if (session.status !== 'open') {
    throw invalidRequest(`Only Checkout Sessions with a status in ["open"] can be expired. This session has status "${session.status}".`, { code: 'checkout_session_not_open' });
  }
  markExpired(core, session);
  return render(core, session, input.expand);
}

export type PayResult =
  | { ok: true; redirect: string | null }
  | { ok: false; error: { code: string; decline_code?: string; message: string }; status: number };

/** The success URL with `{CHECKOUT_SESSION_ID}` filled in, as the hosted page redirects. */
export function successRedirect(session: CheckoutSession): string | null {
  return session.success_url === null ? null : session.success_url.split('{CHECKOUT_SESSION_ID}').join(session.id);
}

/**
 * Pays an open session with a typed test card: the hosted page's form and `/_fake/checkout/:id/pay`
 * both land here. The PaymentIntent is made at the first attempt and reused for retries after a decline.
 */
export function payCheckoutSession(core: PaymentsCore, sessionId: string, cardNumber: string): PayResult {
  const session = getSession(core, sessionId);
  if (session.status === 'expired') {
    return { ok: false, status: 410, error: { code: 'checkout_session_expired', message: 'This checkout session has expired and can no longer be paid.' } };
  }
  if (session.status === 'complete') {
    return { ok: false, status: 409, error: { code: 'checkout_session_complete', message: 'This checkout session has already been paid.' } };
  }
  const outcome = outcomeForCardNumber(cardNumber);
  if (!outcome.ok && outcome.code === 'incorrect_number') {
    // Caught by the card field before anything is charged: no PaymentIntent, no event.
    return { ok: false, status: 402, error: { code: outcome.code, message: outcome.message } };
  }
  return core.action({ requestId: null, idempotencyKey: null, apiVersion: null }, (): PayResult => {
    const intentData = core.state.sessionIntentData[session.id];
    const intent =
      (session.payment_intent ? core.state.paymentIntents[session.payment_intent] : undefined) ??
      newPaymentIntent(core, {
        amount: session.amount_total,
        currency: session.currency,
        transfer_group: intentData?.transfer_group ?? null,
        metadata: intentData?.metadata ?? {},
        description: intentData?.description ?? null,
        allowed_payment_method_types: session.allowed_payment_method_types,
      });
    session.payment_intent = intent.id;
    const method = newCardPaymentMethod(core, normaliseCardNumber(cardNumber).slice(-4));
    const result = attemptPayment(core, intent, method, outcome);
    if (!result.ok) {
      return { ok: false, status: 402, error: { code: result.error.code, ...(result.error.decline_code ? { decline_code: result.error.decline_code } : {}), message: result.error.message } };
    }
    session.status = 'complete';
    session.payment_status = 'paid';
    session.url = null;
    session.customer_details = { email: session.customer_email };
    core.emit('checkout.session.completed', session);
    return { ok: true, redirect: successRedirect(session) };
  });
}

export const checkoutSessionRoutes: Route[] = [
  { method: 'POST', pattern: '/v1/checkout/sessions', handle: (core, req) => createCheckoutSession(core, req.params) },
  {
    method: 'GET',
    pattern: '/v1/checkout/sessions',
    handle: (core, req) => {
      expireDueSessions(core);
      const input = parseParams(sessionListInputSchema, req.params);
      const items = newestFirst(
        core.state.checkoutSessions,
        (s) => (input.payment_intent === undefined || s.payment_intent === input.payment_intent) && (input.status === undefined || s.status === input.status),
      );
      return listBody(core, items, input, '/v1/checkout/sessions');
    },
  },
  {
    method: 'GET',
    pattern: '/v1/checkout/sessions/:id',
    handle: (core, req) => render(core, getSession(core, req.path.id), parseParams(retrieveInputSchema, req.params).expand),
  },
  { method: 'POST', pattern: '/v1/checkout/sessions/:id/expire', handle: expireSession },
  {
    method: 'GET',
    pattern: '/v1/checkout/sessions/:id/line_items',
    handle: (core, req) => {
      const input = parseParams(lineItemListInputSchema, req.params);
      const session = getSession(core, req.path.id);
      const { page, has_more } = paginate(core.state.sessionLineItems[session.id] ?? [], input);
      return { object: 'list', data: page, has_more, url: `/v1/checkout/sessions/${session.id}/line_items` };
    },
  },
];
