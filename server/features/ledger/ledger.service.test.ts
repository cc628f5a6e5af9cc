import { describe, expect, it, beforeEach } from 'vitest';
import fc from 'fast-check';
import { openDb, type Db } from '../../db/client';
import { applyMigrations } from '../../db/migrate';
import { ledgerEntries, ledgerTransactions } from '../../db/schema';
import { ACCOUNTS, LedgerError, createLedger, escrowHeld, postTransaction } from './ledger.service';

function freshDb(): Db {
  const db = openDb(':memory:');
  applyMigrations(db);
  return db;
}

const count = (db: Db) => ({
  transactions: db.select().from(ledgerTransactions).all().length,
  entries: db.select().from(ledgerEntries).all().length,
});

/** A funded booking: 10 000 agreed + 500 service fee charged. */
function fund(db: Db, bookingId: string, key = `charge:${bookingId}`) {
  return postTransaction(db, {
    memo: 'Checkout paid',
    bookingId,
    currency: 'USD',
    key,
    externalId: 'ch_test',
    entries: [
      { account: ACCOUNTS.clearing, amount: 10_500 },
      { account: ACCOUNTS.escrow(bookingId), amount: -10_000 },
      { account: ACCOUNTS.fees, amount: -500 },
    ],
  });
}

describe('ledger', () => {
  let db: Db;
  beforeEach(() => {
    db = freshDb();
  });

  it('refuses entries that do not add up to zero and writes nothing', () => {
    expect(() =>
      postTransaction(db, {
        memo: 'broken',
        bookingId: 'b1',
        currency: 'USD',
        entries: [
          { account: ACCOUNTS.clearing, amount: 1000 },
          { account: ACCOUNTS.escrow('b1'), amount: -999 },
        ],
      }),
    ).toThrow(LedgerError);
    expect(count(db)).toEqual({ transactions: 0, entries: 0 });
  });

  it.each([
    ['a fractional amount', [{ account: 'refunds', amount: 0.5 }, { account: 'processor:clearing', amount: -0.5 }]],
    ['a zero entry', [{ account: 'refunds', amount: 0 }, { account: 'processor:clearing', amount: 0 }]],
    ['a single entry', [{ account: 'refunds', amount: 0 }]],
    ['an account name with spaces', [{ account: 'my account', amount: 5 }, { account: 'refunds', amount: -5 }]],
  ])('refuses %s', (_what, entries) => {
    expect(() => postTransaction(db, { memo: 'x', bookingId: null, currency: 'USD', entries })).toThrow(LedgerError);
    expect(count(db).transactions).toBe(0);
  });

  it('refuses a currency the platform does not price in', () => {
    expect(() => postTransaction(db, { memo: 'x', bookingId: null, currency: 'XYZ', entries: [{ account: 'refunds', amount: 5 }, { account: 'processor:clearing', amount: -5 }] })).toThrow(/Unsupported currency/);
  });

  it('posts a step with the same key only once', () => {
    const first = fund(db, 'b1');
    const second = fund(db, 'b1');
    expect(first.duplicate).toBe(false);
    expect(second).toEqual({ id: first.id, duplicate: true });
    expect(count(db)).toEqual({ transactions: 1, entries: 3 });
  });

  it('keeps balances per account and currency, each currency summing to zero', () => {
    const ledger = createLedger(db);
    fund(db, 'b1');
    ledger.postTransaction({
      memo: 'Released',
      bookingId: 'b1',
      currency: 'USD',
      entries: [
        { account: ACCOUNTS.escrow('b1'), amount: 10_000 },
        { account: ACCOUNTS.payable('drummer1'), amount: -9_000 },
        { account: ACCOUNTS.commission, amount: -1_000 },
      ],
    });
    ledger.postTransaction({ memo: 'Yen booking', bookingId: 'b2', currency: 'jpy', entries: [{ account: ACCOUNTS.clearing, amount: 3000 }, { account: ACCOUNTS.escrow('b2'), amount: -3000 }] });
    const { accounts, totals } = ledger.balances();
    expect(totals).toEqual(expect.arrayContaining([{ currency: 'USD', sum: 0 }, { currency: 'JPY', sum: 0 }]));
    expect(accounts).toContainEqual({ account: 'payable:drummer1', currency: 'USD', balance: -9_000 });
    expect(accounts).toContainEqual({ account: 'processor:clearing', currency: 'USD', balance: 10_500 });
    expect(accounts).toContainEqual({ account: 'escrow:b2', currency: 'JPY', balance: -3000 });
    expect(escrowHeld(db, 'b1', 'USD')).toBe(0);
    expect(escrowHeld(db, 'b2', 'JPY')).toBe(3000);
  });

  it("shows one booking's transactions in order with only that booking's part of shared accounts", () => {
    const ledger = createLedger(db);
    fund(db, 'b1');
    fund(db, 'b2');
    const view = ledger.bookingLedger('b1');
    expect(view.transactions).toHaveLength(1);
    expect(view.transactions[0].entries).toEqual([
      { account: 'processor:clearing', amount: 10_500 },
      { account: 'escrow:b1', amount: -10_000 },
      { account: 'platform:fees', amount: -500 },
    ]);
    expect(view.balances).toContainEqual({ account: 'platform:fees', currency: 'USD', balance: -500 });
    expect(view.escrowHeldMinor).toBe(10_000);
  });

  it('writes nothing when the surrounding database transaction rolls back', () => {
    expect(() =>
      db.transaction((tx) => {
        fund(tx as unknown as Db, 'b1');
        throw new Error('processor answer could not be recorded');
      }),
    ).toThrow(/could not be recorded/);
    expect(count(db)).toEqual({ transactions: 0, entries: 0 });
  });

  it('sums to zero after any sequence of balanced or refused posts (property)', () => {
    const entryArb = fc.record({ account: fc.constantFrom('processor:clearing', 'escrow:b1', 'payable:u1', 'platform:fees', 'refunds'), amount: fc.integer({ min: -50_000, max: 50_000 }).filter((n) => n !== 0) });
    fc.assert(
      fc.property(fc.array(fc.array(entryArb, { minLength: 1, maxLength: 4 }), { maxLength: 12 }), fc.boolean(), (batches, balanceThem) => {
        const local = freshDb();
        const ledger = createLedger(local);
        let posted = 0;
        for (const batch of batches) {
          const sum = batch.reduce((s, e) => s + e.amount, 0);
          const entries = balanceThem && sum !== 0 ? [...batch, { account: 'processor:clearing', amount: -sum }] : batch;
          const balanced = entries.length >= 2 && entries.reduce((s, e) => s + e.amount, 0) === 0;
          try {
            ledger.postTransaction({ memo: 'p', bookingId: 'b1', currency: 'EUR', entries });
            posted += 1;
            expect(balanced).toBe(true);
          } catch (error) {
            expect(error).toBeInstanceOf(LedgerError);
            expect(balanced).toBe(false);
          }
        }
        for (const total of ledger.balances().totals) expect(total.sum).toBe(0);
        expect(count(local).transactions).toBe(posted);
        local.$client.close();
      }),
      { numRuns: 60 },
    );
  });
});
