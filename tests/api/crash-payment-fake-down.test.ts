// The payment service down, with real processes (issue 7). The payment fake runs in its own process and is
// killed with SIGKILL. While it is gone a songwriter's checkout and a drummer's payout onboarding answer
// 503 payment_unavailable with a "try again" message and change nothing in the database; an admin's refund
// and an admin's dispute split are decided and recorded, and their money goes out once the service is back. After the fake restarts on the
// same state the same clicks succeed and the books agree with the processor.
import { afterAll, describe, expect, it } from 'vitest';
import type { Db } from '../../server/db/client';
import { bookingStatus, insertBooking, moveBooking } from './helpers/money';
import { booksCheck, crashPerson, fundOverHttp, onboardOverHttp, openDataDb, stripeAt } from './helpers/crash-world';
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
    // A delivered booking in dispute, its drummer ready to be paid, for the admin to settle while the service is down.
    const paidDrummer = await crashPerson(base, sql, { email: 'dr2-fake-down@kitlane.test', roles: ['drummer'], displayName: 'Paid Drummer' });
    await onboardOverHttp(paymentsUrl, stripe, paidDrummer);
    const contested = insertBooking(sql, { songwriterId: songwriter.id, drummerId: paidDrummer.id, songTitle: 'Contested Song' });
    await fundOverHttp(sql, paymentsUrl, songwriter, contested);
    moveBooking(sql, contested, ['recording', 'delivered']);
    const opened = await songwriter.client.post(`/api/bookings/${contested}/disputes`, { reason: 'technical_problems', text: 'The snare stem is clipped all through the second chorus.' });
    expect(opened.status).toBe(201);

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

    // A dispute split likewise: the decision and the booking's end are recorded, the transfer and refund wait.
    const split = await admin.client.post(`/api/admin/disputes/${opened.body.dispute.id}/settle`, { outcome: 'split', songwriterPercent: 50, note: 'Half back: the second chorus needs a new take.' });
    expect(split.status).toBe(200);
    expect(split.body.dispute).toMatchObject({ status: 'settled', outcome: 'split' });
    expect(bookingStatus(sql, contested)).toBe('settled');
    const splitWaiting = sql.$client.prepare(`select kind, status, last_error as lastError from money_intents where booking_id = ?`).all(contested) as { kind: string; status: string; lastError: string | null }[];
    expect(splitWaiting.map((i) => i.kind).sort()).toEqual(expect.arrayContaining(['refund', 'transfer']));
    expect(splitWaiting.every((i) => i.status === 'pending' && i.lastError !== null)).toBe(true);

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
    await waitFor('the split to go out', () => {
      const open = sql.$client.prepare(`select count(*) as n from money_intents where booking_id = ? and status != 'done'`).get(contested) as { n: number };
      return open.n === 0 ? true : null;
    }, 90_000, 250);
    // Each waiting payment went out exactly once: one refund to the songwriter, one transfer per payee intent.
    const splitRefunds = (await stripe.refunds.list({ limit: 100 })).data.filter((r) => r.metadata?.bookingId === contested);
    const splitTransfers = (await stripe.transfers.list({ limit: 100 })).data.filter((t) => t.metadata?.bookingId === contested);
    expect(splitRefunds).toHaveLength(splitWaiting.filter((i) => i.kind === 'refund').length);
    expect(splitTransfers).toHaveLength(splitWaiting.filter((i) => i.kind === 'transfer').length);
    const books = await booksCheck(sql, stripe);
    expect(books.sums.every((s) => s === 0)).toBe(true);
    expect(books.negativeEscrows).toEqual([]);
    expect(books.differences).toEqual([]);
    await killHard(server);
    await killHard(fake);
  }, 175_000);
});
