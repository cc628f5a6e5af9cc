import { z } from 'zod';
import { executionError, invalidRequest, noSuch } from './errors';
import { ID_PREFIX, newId } from './ids';
import { checkAmountRange, checkCurrency, formatAmount } from './money';
import { expandParam, intParam, listParams, metadataParam, parseParams, stringParam, boolParam } from './params';
import { PLATFORM, type PaymentsCore } from './core';
import { listBody, newestFirst, render } from './render';
import { mergeMetadata } from './refunds';
import type { Account, Charge, Transfer, TransferReversal } from './types';
import type { Route } from './routes-types';

export const transferCreateInputSchema = z.strictObject({
  amount: intParam,
  currency: z.string(),
  destination: z.string(),
  transfer_group: stringParam().optional(),
  source_transaction: z.string().optional(),
  metadata: metadataParam.optional(),
  description: stringParam(1000).optional(),
  expand: expandParam,
});
export type TransferCreateInput = z.output<typeof transferCreateInputSchema>;

export const transferReversalCreateInputSchema = z.strictObject({
  amount: intParam.optional(),
  metadata: metadataParam.optional(),
  description: stringParam(1000).optional(),
  refund_application_fee: boolParam.optional(),
  expand: expandParam,
});

const transferListInputSchema = z.strictObject({ ...listParams, transfer_group: z.string().optional(), destination: z.string().optional() });
const transferUpdateInputSchema = z.strictObject({ metadata: metadataParam.optional(), description: stringParam(1000).optional(), expand: expandParam });
const reversalListInputSchema = z.strictObject({ ...listParams });
const retrieveInputSchema = z.strictObject({ expand: expandParam });

function getTransfer(core: PaymentsCore, id: string): Transfer {
  const transfer = core.state.transfers[id];
  if (!transfer) throw noSuch('transfer', id);
  return transfer;
}

function destinationAccount(core: PaymentsCore, id: string): Account {
  const account = core.state.accounts[id];
  if (!account) throw invalidRequest(`No such destination: '${id}'`, { code: 'resource_missing', param: 'destination' });
  if (account.capabilities.transfers !== 'active') {
    // From memory of the hosted error: a connected account must finish onboarding before it can be paid.
    throw invalidRequest(
      'Your destination account needs to have at least one of the following capabilities enabled: transfers, crypto_transfers, legacy_payments',
      { code: 'insufficient_capabilities_for_transfer', param: 'destination' },
    );
  }
  return account;
}

/** What is left of a charge to transfer out: its amount less refunds and less earlier (unreversed) transfers. */
export function transferableFromCharge(core: PaymentsCore, charge: Charge): number {
  const transferred = Object.values(core.state.transfers)
    .filter((t) => t.source_transaction === charge.id)
    .reduce((sum, t) => sum + t.amount - t.amount_reversed, 0);
  return charge.amount - charge.amount_refunded - transferred;
}

function sourceCharge(core: PaymentsCore, id: string, currency: string): Charge {
  const charge = core.state.charges[id];
  if (!charge) throw invalidRequest(`No such charge: '${id}'`, { code: 'resource_missing', param: 'source_transaction' });
  if (charge.status !== 'succeeded') throw invalidRequest(`The source transaction ${id} did not succeed.`, { param: 'source_transaction' });
  if (charge.currency !== currency) {
    throw invalidRequest(`The currency of the transfer (${currency}) must match the currency of the source transaction (${charge.currency}).`, { param: 'currency' });
  }
  return charge;
}

function checkFundsForTransfer(core: PaymentsCore, amount: number, currency: string, charge: Charge | null): void {
  if (charge) {
    const left = transferableFromCharge(core, charge);
    if (amount > left) {
      throw executionError(
        `Insufficient funds in the source transaction ${charge.id}: the transfer (${formatAmount(amount, currency)}) is more than what remains of the charge after refunds and earlier transfers (${formatAmount(left, currency)}).`,
        'balance_insufficient',
        'amount',
      );
    }
  }
  // Funds are available at once in this fake, so the platform balance must also cover the transfer;
  // otherwise money would appear from nowhere.
  const available = core.balanceOf(PLATFORM, currency);
  if (amount > available) {
    throw executionError(
      `You have insufficient available funds in your account (${formatAmount(available, currency)} available, ${formatAmount(amount, currency)} requested).`,
      'balance_insufficient',
      'amount',
    );
  }
}

function createTransfer(core: PaymentsCore, params: Parameters<Route['handle']>[1]['params']): unknown {
  const input = parseParams(transferCreateInputSchema, params);
  const currency = checkCurrency(input.currency, core.config.minimums);
  checkAmountRange(input.amount, currency);
  const destination = destinationAccount(core, input.destination);
  const charge = input.source_transaction === undefined ? null : sourceCharge(core, input.source_transaction, currency);
  checkFundsForTransfer(core, input.amount, currency, charge);
  const id = newId(ID_PREFIX.transfer);
  const txn = core.recordMovement(PLATFORM, { amount: -input.amount, currency, type: 'transfer', source: id, description: input.description ?? null });
  core.recordMovement(destination.id, { amount: input.amount, currency, type: 'payment', source: id, description: input.description ?? null });
  const transfer: Transfer = {
    id,
    object: 'transfer',
    amount: input.amount,
    amount_reversed: 0,
    balance_transaction: txn,
    created: core.now(),
    currency,
    description: input.description ?? null,
    destination: destination.id,
    destination_payment: null,
    livemode: false,
    metadata: input.metadata ?? {},
    reversed: false,
    source_transaction: charge?.id ?? null,
    source_type: 'card',
    // A transfer from a charge joins the charge's group unless told otherwise.
    transfer_group: input.transfer_group ?? charge?.transfer_group ?? null,
  };
  core.state.transfers[id] = transfer;
  core.emit('transfer.created', render(core, transfer));
  return render(core, transfer, input.expand);
}

function createReversal(core: PaymentsCore, req: Parameters<Route['handle']>[1]): unknown {
  const input = parseParams(transferReversalCreateInputSchema, req.params);
  const transfer = getTransfer(core, req.path.id);
  const remaining = transfer.amount - transfer.amount_reversed;
  if (remaining === 0) throw executionError(`Transfer ${transfer.id} has already been fully reversed.`, 'transfer_already_reversed');
  const amount = input.amount ?? remaining;
  checkAmountRange(amount, transfer.currency);
  if (amount > remaining) {
    throw executionError(
      `Reversal amount (${formatAmount(amount, transfer.currency)}) is greater than the unreversed amount on the transfer (${formatAmount(remaining, transfer.currency)}).`,
      'amount_too_large',
      'amount',
    );
  }
  const connected = core.balanceOf(transfer.destination, transfer.currency);
  if (amount > connected) {
    throw executionError(
      `The connected account ${transfer.destination} has insufficient available funds for this reversal (${formatAmount(connected, transfer.currency)} available).`,
      'balance_insufficient',
      'amount',
    );
  }
  const id = newId(ID_PREFIX.transferReversal);
  const txn = core.recordMovement(PLATFORM, { amount, currency: transfer.currency, type: 'transfer_refund', source: id });
  core.recordMovement(transfer.destination, { amount: -amount, currency: transfer.currency, type: 'payment_refund', source: id });
  const reversal: TransferReversal = {
    id,
    object: 'transfer_reversal',
    amount,
    balance_transaction: txn,
    created: core.now(),
    currency: transfer.currency,
    destination_payment_refund: null,
    metadata: input.metadata ?? {},
    source_refund: null,
    transfer: transfer.id,
  };
  core.state.transferReversals[id] = reversal;
  const previous = { amount_reversed: transfer.amount_reversed, reversed: transfer.reversed };
  transfer.amount_reversed += amount;
  transfer.reversed = transfer.amount_reversed === transfer.amount;
  core.emit('transfer.reversed', render(core, transfer), { previous });
  return render(core, reversal, input.expand);
}

function getReversal(core: PaymentsCore, transferId: string, id: string): TransferReversal {
  const reversal = core.state.transferReversals[id];
  if (!reversal || reversal.transfer !== transferId) throw noSuch('transfer_reversal', id);
  return reversal;
}

function updateTransfer(core: PaymentsCore, req: Parameters<Route['handle']>[1]): unknown {
  const input = parseParams(transferUpdateInputSchema, req.params);
  const transfer = getTransfer(core, req.path.id);
  if (input.metadata !== undefined) transfer.metadata = mergeMetadata(transfer.metadata, input.metadata);
  if (input.description !== undefined) transfer.description = input.description;
  return render(core, transfer, input.expand);
}

export const transferRoutes: Route[] = [
  { method: 'POST', pattern: '/v1/transfers', handle: (core, req) => createTransfer(core, req.params) },
  {
    method: 'GET',
    pattern: '/v1/transfers',
    handle: (core, req) => {
      const input = parseParams(transferListInputSchema, req.params);
      const items = newestFirst(
        core.state.transfers,
        (t) => (input.transfer_group === undefined || t.transfer_group === input.transfer_group) && (input.destination === undefined || t.destination === input.destination),
      );
      return listBody(core, items, input, '/v1/transfers');
    },
  },
  { method: 'GET', pattern: '/v1/transfers/:id', handle: (core, req) => render(core, getTransfer(core, req.path.id), parseParams(retrieveInputSchema, req.params).expand) },
  { method: 'POST', pattern: '/v1/transfers/:id', handle: updateTransfer },
  { method: 'POST', pattern: '/v1/transfers/:id/reversals', handle: createReversal },
  {
    method: 'GET',
    pattern: '/v1/transfers/:id/reversals',
    handle: (core, req) => {
      const input = parseParams(reversalListInputSchema, req.params);
      const transfer = getTransfer(core, req.path.id);
      return listBody(core, newestFirst(core.state.transferReversals, (r) => r.transfer === transfer.id), input, `/v1/transfers/${transfer.id}/reversals`);
    },
  },
  {
    method: 'GET',
    pattern: '/v1/transfers/:transferId/reversals/:id',
    handle: (core, req) => render(core, getReversal(core, req.path.transferId, req.path.id), parseParams(retrieveInputSchema, req.params).expand),
  },
];
