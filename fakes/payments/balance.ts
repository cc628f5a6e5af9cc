import { z } from 'zod';
import { noSuch } from './errors';
import { expandParam, listParams, parseParams } from './params';
import { PLATFORM, type PaymentsCore } from './core';
import { listBody, newestFirst, render } from './render';
import type { Route } from './routes-types';

const balanceInputSchema = z.strictObject({ expand: expandParam });
const balanceTransactionListInputSchema = z.strictObject({
  ...listParams,
  type: z.string().optional(),
  source: z.string().optional(),
  currency: z.string().optional(),
});
const retrieveInputSchema = z.strictObject({ expand: expandParam });

interface BalanceAmount {
  amount: number;
  currency: string;
  source_types: { card: number };
}

/**
 * The balance object: available per currency, pending always zero because funds settle at once here.
 * With no movement yet it shows the owner's default currency at zero, as a new account does.
 */
export function balanceBody(core: PaymentsCore, owner: string): Record<string, unknown> {
  const amounts = core.state.balances[owner] ?? {};
  const fallback = owner === PLATFORM ? 'usd' : (core.state.accounts[owner]?.default_currency ?? 'usd');
  const currencies = Object.keys(amounts).length > 0 ? Object.keys(amounts).sort() : [fallback];
  const available: BalanceAmount[] = currencies.map((currency) => ({ amount: amounts[currency] ?? 0, currency, source_types: { card: amounts[currency] ?? 0 } }));
  const pending: BalanceAmount[] = currencies.map((currency) => ({ amount: 0, currency, source_types: { card: 0 } }));
  return {
    object: 'balance',
    available,
    pending,
    livemode: false,
    ...(owner === PLATFORM ? { connect_reserved: currencies.map((currency) => ({ amount: 0, currency })) } : {}),
  };
}

function ownerOf(account: string | null): string {
  return account ?? PLATFORM;
}

export const balanceRoutes: Route[] = [
  {
    method: 'GET',
    pattern: '/v1/balance',
    connectAware: true,
    handle: (core, req) => {
      parseParams(balanceInputSchema, req.params);
      return balanceBody(core, ownerOf(req.account));
    },
  },
  {
    method: 'GET',
    pattern: '/v1/balance_transactions',
    connectAware: true,
    handle: (core, req) => {
      const input = parseParams(balanceTransactionListInputSchema, req.params);
      const owner = ownerOf(req.account);
      const items = newestFirst(
        core.state.balanceTransactions,
        (t) =>
          core.state.balanceTransactionOwner[t.id] === owner &&
          (input.type === undefined || t.type === input.type) &&
          (input.source === undefined || t.source === input.source) &&
          (input.currency === undefined || t.currency === input.currency),
      );
      return listBody(core, items, input, '/v1/balance_transactions');
    },
  },
  {
    method: 'GET',
    pattern: '/v1/balance_transactions/:id',
    connectAware: true,
    handle: (core, req) => {
      const input = parseParams(retrieveInputSchema, req.params);
      const txn = core.state.balanceTransactions[req.path.id];
      if (!txn || core.state.balanceTransactionOwner[txn.id] !== ownerOf(req.account)) throw noSuch('balance_transaction', req.path.id);
      return render(core, txn, input.expand);
    },
  },
];
