// The payment service down, with real processes (issue 7). The payment fake runs in its own process and is
// killed with SIGKILL. While it is gone a songwriter's checkout and a drummer's payout onboarding answer
// 503 payment_unavailable with a "try again" message and change nothing in the database; an admin's refund
// is decided and recorded, and its money goes out once the service is back. After the fake restarts on the
// same state the same clicks succeed and the books agree with the processor.
import { afterAll, describe, expect, it } from 'vitest';
import type { Db } from '../../server/db/client';
import { bookingStatus, insertBooking } from './helpers/money';
import { booksCheck, crashPerson, fundOverHttp, openDataDb, stripeAt } from './helpers/crash-world';
import { freePort, killAll, killHard, startApp, startPaymentsFakeProcess, tempDataDir, waitFor } from './helpers/processes';

const data = tempDataDir();
let db: Db | undefined;

afterAll(async () => {
  await killAll();
  db?.$client.close();
  data.remove();
});

const MONEY_TABLES = ['bookings', 'booking_payments', 'booking_money', 'money_intents', 'ledger_transactions', 'ledger_entries', 'payout_accounts'];

/** Every row of the tables money touches, to show a refused action left them as they were. */
function moneySnapshot(sql: Db): Record<string, unknown[]> {
  return Object.fromEntries(MONEY_TABLES.map((t) => [t, sql.$client.prepare(`select * from ${t} order by rowid`).all()]));
}

function expectTryAgain(res: { status: number; body: any }): void {
  expect(res.status).toBe(503);
  expect(res.body.error.code).toBe('payment_unavailable');
  expect(res.body.error.message).toMatch(/payment service cannot be reached/);
  expect(res.body.error.message).toMatch(/try again/);
}

describe('fault recovery: the payment service stopped and started again', () => {
  it('asks users to try again while it is down, changes nothing, and the same actions succeed once it is back', async () => {
    const [appPort, paymentsPort] = [await freePort(), await freePort()];
    const base = `http://127.0.0.1:${appPort}`;
    const paymentsUrl = `http://127.0.0.1:${paymentsPort}`;
    const startFake = () => startPaymentsFakeProcess({ dataDir: data.dir, port: paymentsPort, appPort });
    let fake = await startFake();
    const server = await startApp({ dataDir: data.dir, port: appPort, paymentsPort });
    const sql = openDataDb(data.dir);
    db = sql;
    const stripe = stripeAt(paymentsPort);

    const songwriter = await crashPerson(base, sql, { email: 'sw-fake-down@kitlane.test', roles: ['songwriter'], displayName: 'Down Songwriter' });
    const drummer = await crashPerson(base, sql, { email: 'dr-fake-down@kitlane.test', roles: ['drummer'], displayName: 'Down Drummer' });
    const admin = await crashPerson(base, sql, { email: 'ad-fake-down@kitlane.test', roles: ['songwriter'], displayName: 'Down Admin', admin: true });
    const unpaid = insertBooking(sql, { songwriterId: songwriter.id, drummerId: drummer.id, songTitle: 'Unpaid Song' });
    const funded = insertBooking(sql, { songwriterId: songwriter.id, drummerId: drummer.id, songTitle: 'Funded Song' });
    await fundOverHttp(sql, paymentsUrl, songwriter, funded);

    await killHard(fake);
    const before = moneySnapshot(sql);
    expectTryAgain(await songwriter.client.post(`/api/bookings/${unpaid}/checkout`));
    expectTryAgain(await drummer.client.post('/api/payouts/account/onboarding'));
    expect(moneySnapshot(sql)).toEqual(before);

    // A refund is a decision first: it is recorded now, and the repair job sends it when the service returns.
    const refund = await admin.client.post(`/api/bookings/${funded}/refund`, { reason: 'Refund while the payment service is down' });
    expect(refund.status).toBe(200);
    expect(refund.body.status).toBe('cancelled');
    const waiting = sql.$client.prepare(`select status, last_error as lastError from money_intents where booking_id = ? and kind = 'refund'`).all(funded) as { status: string; lastError: string | null }[];
    expect(waiting.length).toBeGreaterThan(0);
    expect(waiting.every((i) => i.status === 'pending' && i.lastError !== null)).toBe(true);

    fake = await startFake();
    const checkout = await songwriter.client.post(`/api/bookings/${unpaid}/checkout`);
    expect(checkout.status).toBe(201);
    expect(checkout.body.url).toMatch(new RegExp(`^${paymentsUrl}/checkout/`));
    const payments = sql.$client.prepare(`select status, session_id as sessionId from booking_payments where booking_id = ?`).all(unpaid) as { status: string; sessionId: string }[];
    expect(payments).toEqual([{ status: 'open', sessionId: checkout.body.sessionId }]);
    const onboarding = await drummer.client.post('/api/payouts/account/onboarding');
    expect(onboarding.status).toBe(201);
    expect(onboarding.body.url).toMatch(new RegExp(`^${paymentsUrl}/onboarding/`));

    await waitFor('the refund to go out', () => {
      const open = sql.$client.prepare(`select count(*) as n from money_intents where booking_id = ? and status != 'done'`).get(funded) as { n: number };
      return open.n === 0 ? true : null;
    }, 90_000, 250);
    expect(bookingStatus(sql, funded)).toBe('cancelled');
    const refunds = await stripe.refunds.list({ limit: 100 });
    expect(refunds.data.filter((r) => r.metadata?.bookingId === funded)).toHaveLength(waiting.length);
    const books = await booksCheck(sql, stripe);
    expect(books.sums.every((s) => s === 0)).toBe(true);
    expect(books.negativeEscrows).toEqual([]);
    expect(books.differences).toEqual([]);
    await killHard(server);
    await killHard(fake);
  }, 175_000);
});
