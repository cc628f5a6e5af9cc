import { sqliteTable, text, integer, index } from 'drizzle-orm/sqlite-core';

// The double-entry ledger (DESIGN.md, Money). One row per transaction, one row per entry; the entries of a
// transaction add up to zero. Amounts are signed integer minor units: positive = debit, negative = credit.
export const ledgerTransactions = sqliteTable(
  'ledger_transactions',
  {
    id: text().primaryKey(),
    // A key per logical money step (e.g. "charge:ch_…"): posting the same step twice is refused by the index,
    // so a repeated webhook or a repair job can never post it again.
    key: text().unique(),
    bookingId: text(),
    currency: text().notNull(),
    memo: text().notNull(),
    // The processor object this transaction mirrors (charge, transfer, refund), for reconciliation.
    externalId: text(),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('ledger_transactions_booking_idx').on(t.bookingId)],
);

export const ledgerEntries = sqliteTable(
  'ledger_entries',
  {
    id: integer().primaryKey({ autoIncrement: true }),
    transactionId: text()
      .notNull()
      .references(() => ledgerTransactions.id),
    account: text().notNull(),
    currency: text().notNull(),
    amount: integer().notNull(),
  },
  (t) => [index('ledger_entries_account_idx').on(t.account, t.currency), index('ledger_entries_transaction_idx').on(t.transactionId)],
);
