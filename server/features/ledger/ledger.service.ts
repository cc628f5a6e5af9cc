// The double-entry ledger (DESIGN.md, Money): every movement is one balanced transaction in integer minor
// units. Sign convention: positive = debit, negative = credit, so each transaction's entries sum to zero,
// and so does the whole ledger per currency.
//   processor:clearing  debit-normal: what the platform holds at the processor (reconciled with its balance)
//   escrow:<booking>    credit-normal: money held for a booking's work until release, refund or split
//   payable:<user>      credit-normal: released to a payee, not yet transferred (waits for a payout account)
//   refunds             credit-normal: decided refunds the processor has not confirmed yet
//   platform:fees       credit-normal: songwriters' service fees
//   platform:commission credit-normal: the commission kept from payees' shares
import { randomUUID } from 'node:crypto';
import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { ledgerEntries, ledgerTransactions } from '../../db/schema';
import { parseCurrency } from '@shared/money';
import type { LedgerBalance, LedgerTransactionView, BookingLedgerView } from '@shared/schemas/payments';
import type Stripe from 'stripe';
import { ACCOUNTS, ACCOUNT_NAME, LedgerError } from './ledger.accounts';
import { reconcile } from './reconcile';

export { ACCOUNTS, LedgerError };

export type LedgerEntryInput = { account: string; amount: number };
export type PostTransactionInput = {
  memo: string;
  bookingId: string | null;
  currency: string;
  entries: LedgerEntryInput[];
  /** One key per logical money step; a second post with the same key changes nothing. */
  key?: string;
  externalId?: string | null;
  at?: Date;
};
export type PostResult = { id: string; duplicate: boolean };

function assertEntries(entries: LedgerEntryInput[]): void {
  if (!Array.isArray(entries) || entries.length < 2) throw new LedgerError('ledger_invalid_entry', 'A transaction needs at least two entries');
  for (const entry of entries) {
    if (!ACCOUNT_NAME.test(entry.account)) throw new LedgerError('ledger_invalid_entry', `"${entry.account}" is not a ledger account name`);
    if (!Number.isSafeInteger(entry.amount) || entry.amount === 0) {
      throw new LedgerError('ledger_invalid_entry', `Entry amounts are non-zero integer minor units (got ${String(entry.amount)} on ${entry.account})`);
    }
  }
  const sum = entries.reduce((total, entry) => total + entry.amount, 0);
  if (sum !== 0) throw new LedgerError('ledger_unbalanced', `Entries must add up to zero; these add up to ${sum}`);
}

/**
 * Posts one balanced transaction inside the caller's (synchronous) database transaction. Unbalanced or
 * malformed entries are refused before anything is written. With a `key` the post is idempotent.
 */
export function postTransaction(tx: Db, input: PostTransactionInput): PostResult {
  assertEntries(input.entries);
  const currency = parseCurrency(input.currency);
  if (input.key) {
    const existing = tx.select({ id: ledgerTransactions.id }).from(ledgerTransactions).where(eq(ledgerTransactions.key, input.key)).get();
    if (existing) return { id: existing.id, duplicate: true };
  }
  const id = randomUUID();
  tx.insert(ledgerTransactions)
    .values({ id, key: input.key ?? null, bookingId: input.bookingId, currency, memo: input.memo, externalId: input.externalId ?? null, createdAt: input.at ?? new Date() })
    .run();
  tx.insert(ledgerEntries)
    .values(input.entries.map((entry) => ({ transactionId: id, account: entry.account, currency, amount: entry.amount })))
    .run();
  return { id, duplicate: false };
}

/** The debit-positive balance of one account in one currency (credit-normal accounts read negative). */
export function accountBalance(tx: Db, account: string, currency: string): number {
  const row = tx
    .select({ total: sql<number>`coalesce(sum(${ledgerEntries.amount}), 0)` })
    .from(ledgerEntries)
    .where(and(eq(ledgerEntries.account, account), eq(ledgerEntries.currency, parseCurrency(currency))))
    .get();
  return Number(row?.total ?? 0);
}

/** Money held in a booking's escrow (its credit balance): never below zero when the rules hold. */
export function escrowHeld(tx: Db, bookingId: string, currency: string): number {
  const balance = accountBalance(tx, ACCOUNTS.escrow(bookingId), currency);
  // Never -0: an emptied escrow reads as plain zero.
  return balance === 0 ? 0 : -balance;
}

export function hasPosted(tx: Db, key: string): boolean {
  return !!tx.select({ id: ledgerTransactions.id }).from(ledgerTransactions).where(eq(ledgerTransactions.key, key)).get();
}

function balancesWhere(db: Db, accounts?: string[]): LedgerBalance[] {
  const rows = db
    .select({ account: ledgerEntries.account, currency: ledgerEntries.currency, balance: sql<number>`sum(${ledgerEntries.amount})` })
    .from(ledgerEntries)
    .where(accounts ? inArray(ledgerEntries.account, accounts) : undefined)
    .groupBy(ledgerEntries.account, ledgerEntries.currency)
    .orderBy(asc(ledgerEntries.account), asc(ledgerEntries.currency))
    .all();
  return rows.map((r) => ({ account: r.account, currency: r.currency, balance: Number(r.balance) }));
}

function transactionViews(db: Db, bookingId: string): LedgerTransactionView[] {
  const txs = db.select().from(ledgerTransactions).where(eq(ledgerTransactions.bookingId, bookingId)).orderBy(asc(ledgerTransactions.createdAt), asc(ledgerTransactions.id)).all();
  if (txs.length === 0) return [];
  const entries = db
    .select()
    .from(ledgerEntries)
    .where(inArray(ledgerEntries.transactionId, txs.map((t) => t.id)))
    .orderBy(asc(ledgerEntries.id))
    .all();
  return txs.map((t) => ({
    id: t.id,
    memo: t.memo,
    currency: t.currency,
    externalId: t.externalId,
    createdAt: t.createdAt.toISOString(),
    entries: entries.filter((e) => e.transactionId === t.id).map((e) => ({ account: e.account, amount: e.amount })),
  }));
}

export function createLedger(db: Db) {
  return {
    postTransaction: (input: PostTransactionInput, tx: Db = db) => postTransaction(tx, input),

    /** Every account's balance per currency, and per currency the sum of all (zero when the books balance). */
    balances(): { accounts: LedgerBalance[]; totals: { currency: string; sum: number }[] } {
      const accounts = balancesWhere(db);
      const totals = new Map<string, number>();
      for (const row of accounts) totals.set(row.currency, (totals.get(row.currency) ?? 0) + row.balance);
      return { accounts, totals: [...totals].map(([currency, sum]) => ({ currency, sum })) };
    },

    /** One booking's transactions in order, with the balances of the accounts they touched. */
    bookingLedger(bookingId: string): BookingLedgerView {
      const transactions = transactionViews(db, bookingId);
      const touched = [...new Set(transactions.flatMap((t) => t.entries.map((e) => e.account)))];
      // Balances of shared accounts (fees, clearing) would mix in other bookings: sum this booking's entries only.
      const balances = new Map<string, LedgerBalance>();
      for (const t of transactions) {
        for (const e of t.entries) {
          const key = `${e.account}|${t.currency}`;
          const row = balances.get(key) ?? { account: e.account, currency: t.currency, balance: 0 };
          row.balance += e.amount;
          balances.set(key, row);
        }
      }
      const currency = transactions[0]?.currency ?? null;
      return {
        bookingId,
        transactions,
        balances: [...balances.values()].filter((b) => touched.includes(b.account)),
        escrowHeldMinor: currency ? escrowHeld(db, bookingId, currency) : 0,
        currency,
      };
    },

    accountBalance: (account: string, currency: string) => accountBalance(db, account, currency),

    /** Compares the ledger with the processor's balance, transfers and refunds; says what differs. */
    reconcile: (stripe: Stripe) => reconcile(db, stripe),
  };
}
export type Ledger = ReturnType<typeof createLedger>;
