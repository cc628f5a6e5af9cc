import { z } from 'zod';
import { executionError, invalidRequest, noSuch } from './errors';
import { ID_PREFIX, newId } from './ids';
import { checkAmountRange, formatAmount } from './money';
import { enumParam, expandParam, intParam, listParams, metadataParam, parseParams } from './params';
import { PLATFORM, type PaymentsCore } from './core';
import { listBody, newestFirst, render } from './render';
import { getCharge, getPaymentIntent } from './payment-intents';
import type { Charge, Refund } from './types';
import type { Route } from './routes-types';

export const refundCreateInputSchema = z.strictObject({
  charge: z.string().optional(),
  payment_intent: z.string().optional(),
  amount: intParam.optional(),
  reason: enumParam(['duplicate', 'fraudulent', 'requested_by_customer']).optional(),
  metadata: metadataParam.optional(),
  expand: expandParam,
});
export type RefundCreateInput = z.output<typeof refundCreateInputSchema>;

const refundUpdateInputSchema = z.strictObject({ metadata: metadataParam.optional(), expand: expandParam });
const refundListInputSchema = z.strictObject({ ...listParams, charge: z.string().optional(), payment_intent: z.string().optional() });
const retrieveInputSchema = z.strictObject({ expand: expandParam });

/** The charge a refund request points at: by id, or the PaymentIntent's successful charge. */
function chargeToRefund(core: PaymentsCore, input: RefundCreateInput): Charge {
  if (input.charge === undefined && input.payment_intent === undefined) {
    throw invalidRequest('One of the following params should be provided for this request: payment_intent or charge.', { code: 'parameter_missing', param: 'charge' });
  }
  if (input.charge !== undefined) {
    const charge = getCharge(core, input.charge, 'charge');
    if (input.payment_intent !== undefined && charge.payment_intent !== input.payment_intent) {
      throw invalidRequest(`Charge ${charge.id} does not belong to PaymentIntent ${input.payment_intent}.`, { param: 'payment_intent' });
    }
    return charge;
  }
  const intent = getPaymentIntent(core, input.payment_intent as string);
  const charge = intent.status === 'succeeded' && intent.latest_charge ? core.state.charges[intent.latest_charge] : undefined;
  if (!charge) {
    throw invalidRequest(`This PaymentIntent (${intent.id}) does not have a successful charge to refund.`, { code: 'charge_not_refundable', param: 'payment_intent' });
  }
  return charge;
}

function createRefund(core: PaymentsCore, params: Parameters<Route['handle']>[1]['params']): unknown {
  const input = parseParams(refundCreateInputSchema, params);
  const charge = chargeToRefund(core, input);
  if (charge.status !== 'succeeded') throw invalidRequest(`Charge ${charge.id} did not succeed and cannot be refunded.`, { code: 'charge_not_refundable', param: 'charge' });
  const remaining = charge.amount - charge.amount_refunded;
  if (remaining === 0) throw executionError(`Charge ${charge.id} has already been refunded.`, 'charge_already_refunded', 'charge');
  const amount = input.amount ?? remaining;
  checkAmountRange(amount, charge.currency);
  if (amount > remaining) {
    throw executionError(
      `Refund amount (${formatAmount(amount, charge.currency)}) is greater than unrefunded amount on charge (${formatAmount(remaining, charge.currency)})`,
      'amount_too_large',
      'amount',
    );
  }
  const id = newId(ID_PREFIX.refund);
  // The platform pays refunds from its balance; it may go below zero, as the hosted service allows
  // (it then debits the bank account). See the decision record.
  const txn = core.recordMovement(PLATFORM, { amount: -amount, currency: charge.currency, type: 'refund', source: id });
  const refund: Refund = {
    id,
    object: 'refund',
    amount,
    balance_transaction: txn,
    charge: charge.id,
    created: core.now(),
    currency: charge.currency,
    metadata: input.metadata ?? {},
    payment_intent: charge.payment_intent,
    reason: input.reason ?? null,
    status: 'succeeded',
  };
  core.state.refunds[id] = refund;
  const previous = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
  charge.amount_refunded += amount;
  charge.refunded = charge.amount_refunded === charge.amount;
  core.emit('refund.created', refund);
  core.emit('charge.refunded', charge, { previous });
  return render(core, refund, input.expand);
}

function getRefund(core: PaymentsCore, id: string): Refund {
  const refund = core.state.refunds[id];
  if (!refund) throw noSuch('refund', id);
  return refund;
}

/** Metadata updates merge; an empty value deletes the key. */
export function mergeMetadata(current: Record<string, string>, update: Record<string, string>): Record<string, string> {
  const merged = { ...current };
  for (const [key, value] of Object.entries(update)) {
    if (value === '') delete merged[key];
    else merged[key] = value;
  }
  return merged;
}

function updateRefund(core: PaymentsCore, req: Parameters<Route['handle']>[1]): unknown {
  const input = parseParams(refundUpdateInputSchema, req.params);
  const refund = getRefund(core, req.path.id);
  if (input.metadata !== undefined) {
    const previous = { metadata: refund.metadata };
    refund.metadata = mergeMetadata(refund.metadata, input.metadata);
    core.emit('refund.updated', refund, { previous });
  }
  return render(core, refund, input.expand);
}

export const refundRoutes: Route[] = [
  { method: 'POST', pattern: '/v1/refunds', handle: (core, req) => createRefund(core, req.params) },
  {
    method: 'GET',
    pattern: '/v1/refunds',
    handle: (core, req) => {
      const input = parseParams(refundListInputSchema, req.params);
      const items = newestFirst(
        core.state.refunds,
        (r) => (input.charge === undefined || r.charge === input.charge) && (input.payment_intent === undefined || r.payment_intent === input.payment_intent),
      );
      return listBody(core, items, input, '/v1/refunds');
    },
  },
  { method: 'GET', pattern: '/v1/refunds/:id', handle: (core, req) => render(core, getRefund(core, req.path.id), parseParams(retrieveInputSchema, req.params).expand) },
  { method: 'POST', pattern: '/v1/refunds/:id', handle: updateRefund },
];
