// Reconciliation: the ledger's view of the platform's processor balance against the processor's own, and
// every transfer and refund on one side against the other (DESIGN.md, Money: "reconcile with the
// payment processor's balance"). Read-only on both sides.
import { and, eq, like } from 'drizzle-orm';
import type Stripe from 'stripe';
import type { Db } from '../../db/client';
import { ledgerEntries, ledgerTransactions } from '../../db/schema';
import type { ReconciliationView } from '@shared/schemas/payments';
import { ACCOUNTS } from './ledger.accounts';

type Side = { id: string; amount: number; currency: string };

/** Amounts the ledger moved out of processor:clearing for objects whose id starts with `prefix`. */
function ledgerObjects(db: Db, prefix: string): Side[] {
  const rows = db
    .select({ id: ledgerTransactions.externalId, amount: ledgerEntries.amount, currency: ledgerEntries.currency })
    .from(ledgerTransactions)
    .innerJoin(ledgerEntries, eq(ledgerEntries.transactionId, ledgerTransactions.id))
    .where(and(like(ledgerTransactions.externalId, `${prefix}%`), eq(ledgerEntries.account, ACCOUNTS.clearing)))
    .all();
  return rows.map((r) => ({ id: r.id ?? '', amount: -r.amount, currency: r.currency }));
}

function clearingByCurrency(db: Db): Map<string, number> {
  const rows = db.select({ currency: ledgerEntries.currency, amount: ledgerEntries.amount }).from(ledgerEntries).where(eq(ledgerEntries.account, ACCOUNTS.clearing)).all();
  const totals = new Map<string, number>();
  for (const r of rows) totals.set(r.currency, (totals.get(r.currency) ?? 0) + r.amount);
  return totals;
}

function compareObjects(ledger: Side[], processor: Side[], what: string, differences: string[]) {
  const byId = new Map(processor.map((p) => [p.id, p]));
  const ledgerIds = new Set(ledger.map((l) => l.id));
  const missingAtProcessor = ledger.filter((l) => !byId.has(l.id)).map((l) => l.id);
  const missingInLedger = processor.filter((p) => !ledgerIds.has(p.id)).map((p) => p.id);
  const amountMismatch = ledger.filter((l) => {
    const p = byId.get(l.id);
    return p !== undefined && (p.amount !== l.amount || p.currency !== l.currency);
  });
  for (const id of missingInLedger) differences.push(`The processor has ${what} ${id}, which the ledger does not record`);
  for (const id of missingAtProcessor) differences.push(`The ledger records ${what} ${id}, which the processor does not know`);
  for (const l of amountMismatch) {
    const p = byId.get(l.id)!;
    differences.push(`${what} ${l.id}: the ledger says ${l.amount} ${l.currency}, the processor ${p.amount} ${p.currency}`);
  }
  return { ledgerCount: ledger.length, processorCount: processor.length, missingInLedger, missingAtProcessor, amountMismatch: amountMismatch.map((l) => l.id) };
}

const upper = (currency: string) => currency.toUpperCase();

export async function reconcile(db: Db, stripe: Stripe): Promise<ReconciliationView> {
  const [balance, transfers, refunds] = await Promise.all([
    stripe.balance.retrieve(),
    stripe.transfers.list({ limit: 100 }).autoPagingToArray({ limit: 10_000 }),
    stripe.refunds.list({ limit: 100 }).autoPagingToArray({ limit: 10_000 }),
  ]);
  const processorTotals = new Map<string, number>();
  for (const row of [...balance.available, ...balance.pending]) {
    processorTotals.set(upper(row.currency), (processorTotals.get(upper(row.currency)) ?? 0) + row.amount);
  }
  const ledgerTotals = clearingByCurrency(db);
  const differences: string[] = [];
  const currencies = [...new Set([...processorTotals.keys(), ...ledgerTotals.keys()])].sort().map((currency) => {
    const ledgerMinor = ledgerTotals.get(currency) ?? 0;
    const processorMinor = processorTotals.get(currency) ?? 0;
    if (ledgerMinor !== processorMinor) differences.push(`${currency}: the ledger holds ${ledgerMinor} at the processor, the processor's balance is ${processorMinor}`);
    return { currency, ledgerMinor, processorMinor, differenceMinor: processorMinor - ledgerMinor };
  });
  const processorTransfers = transfers.map((t) => ({ id: t.id, amount: t.amount - t.amount_reversed, currency: upper(t.currency) }));
  const processorRefunds = refunds.filter((r) => r.status === 'succeeded' || r.status === 'pending').map((r) => ({ id: r.id, amount: r.amount, currency: upper(r.currency) }));
  const transferReport = compareObjects(ledgerObjects(db, 'tr_'), processorTransfers, 'transfer', differences);
  const refundReport = compareObjects(ledgerObjects(db, 're_'), processorRefunds, 'refund', differences);
  return { ok: differences.length === 0, checkedAt: new Date().toISOString(), currencies, transfers: transferReport, refunds: refundReport, differences };
}
