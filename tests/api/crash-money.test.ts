// Crash between the processor call and the ledger write, with real processes (issue 7). The payment fake
// runs in its own process and holds its answer to the transfer it has just made; the server, waiting for
// that answer, is killed with SIGKILL. On restart the repair job finds the intent half-way, sends it again
// with the same idempotency key (the fake replays the first transfer), records it, and pays the booking
// out: one transfer per payee, and books that sum to zero and agree with the processor. The same holds
// when the transfer was made by a background job (auto-accept): the job is queued again at start, not left
// running until its lease runs out.
import type { ChildProcess } from 'node:child_process';
import { and, eq, like } from 'drizzle-orm';
import type Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Db } from '../../server/db/client';
import { jobs, moneyIntents } from '../../server/db/schema';
import { AUTO_ACCEPT_JOB, scheduleAutoAccept } from '../../server/features/payments/auto-accept';
import { bookingStatus, insertBooking, moveBooking, type Person } from './helpers/money';
import { booksCheck, crashPerson, fakeControl, fundOverHttp, onboardOverHttp, openDataDb, stripeAt } from './helpers/crash-world';
import { freePort, killAll, killHard, startApp, startPaymentsFakeProcess, tempDataDir, waitFor } from './helpers/processes';

const data = tempDataDir();
let db: Db;
let appPort: number;
let paymentsPort: number;
let base: string;
let paymentsUrl: string;

afterAll(async () => {
  await killAll();
  db?.$client.close();
  data.remove();
});

let server: ChildProcess;
let stripe: Stripe;
let songwriter: Person;
let drummer: Person;
let engineer: Person;
let admin: Person;
/** Connected account id → the payee's user id. */
const accounts = new Map<string, string>();

beforeAll(async () => {
  [appPort, paymentsPort] = [await freePort(), await freePort()];
  base = `http://127.0.0.1:${appPort}`;
  paymentsUrl = `http://127.0.0.1:${paymentsPort}`;
  await startPaymentsFakeProcess({ dataDir: data.dir, port: paymentsPort, appPort });
  server = await startApp({ dataDir: data.dir, port: appPort, paymentsPort });
  db = openDataDb(data.dir);
  stripe = stripeAt(paymentsPort);
  songwriter = await crashPerson(base, db, { email: 'sw-crash-money@kitlane.test', roles: ['songwriter'], displayName: 'Crash Songwriter' });
  drummer = await crashPerson(base, db, { email: 'dr-crash-money@kitlane.test', roles: ['drummer'], displayName: 'Crash Drummer' });
  engineer = await crashPerson(base, db, { email: 'en-crash-money@kitlane.test', roles: ['engineer'], displayName: 'Crash Engineer' });
  admin = await crashPerson(base, db, { email: 'ad-crash-money@kitlane.test', roles: ['songwriter'], displayName: 'Crash Admin', admin: true });
  accounts.set(await onboardOverHttp(paymentsUrl, stripe, drummer), drummer.id);
  accounts.set(await onboardOverHttp(paymentsUrl, stripe, engineer), engineer.id);
}, 90_000);

function heldTransfers(): Promise<{ idempotencyKey: string }[]> {
  return waitFor('a transfer answer to be held', async () => {
    const list = (await fakeControl(paymentsUrl, 'GET', 'responses/held')).data as { idempotencyKey: string }[];
    return list.length ? list : null;
  });
}

async function expectBooksBalanced(): Promise<void> {
  const books = await booksCheck(db, stripe);
  expect(books.sums.every((s) => s === 0)).toBe(true);
  expect(books.negativeEscrows).toEqual([]);
  expect(books.differences).toEqual([]);
}

const intentsOf = (bookingId: string) => db.select().from(moneyIntents).where(eq(moneyIntents.bookingId, bookingId)).all();

describe('crash recovery: the server killed between a transfer and its ledger write', () => {
  it('finishes the payout after a restart with exactly one transfer per payee and balanced books', async () => {
    const bookingId = insertBooking(db, { songwriterId: songwriter.id, drummerId: drummer.id, engineerId: engineer.id, totalMinor: 30_000, engineerShareMinor: 10_000 });
    await fundOverHttp(db, paymentsUrl, songwriter, bookingId);

    await fakeControl(paymentsUrl, 'POST', 'responses/hold', { path: '/v1/transfers' });
    // The admin's release waits on the held transfer answer; the kill cuts it off, so its outcome is ignored.
    const release = admin.client.post(`/api/bookings/${bookingId}/release`, { reason: 'Crash test release' }).catch((error: unknown) => error);
    const held = await heldTransfers();
    expect(held).toHaveLength(1);

    // The window: the processor made the transfer, the ledger has not heard of it.
    const made = await stripe.transfers.list({ transfer_group: bookingId });
    expect(made.data).toHaveLength(1);
    const before = intentsOf(bookingId).filter((i) => i.kind === 'transfer');
    expect(before).toHaveLength(2);
    expect(before.every((i) => i.status === 'pending' && i.processorId === null)).toBe(true);
    expect(before.map((i) => i.idempotencyKey)).toContain(held[0].idempotencyKey);

    await killHard(server);
    await release;
    await fakeControl(paymentsUrl, 'POST', 'responses/release');
    expect(bookingStatus(db, bookingId)).toBe('accepted');

    server = await startApp({ dataDir: data.dir, port: appPort, paymentsPort });
    await waitFor('the booking to be paid out', () => (bookingStatus(db, bookingId) === 'paid_out' ? true : null), 60_000, 200);

    const transfers = (await stripe.transfers.list({ transfer_group: bookingId })).data;
    const perPayee = transfers.map((t) => accounts.get(String(t.destination)));
    expect(perPayee.sort()).toEqual([drummer.id, engineer.id].sort());
    const after = intentsOf(bookingId).filter((i) => i.kind === 'transfer');
    expect(after.every((i) => i.status === 'done')).toBe(true);
    expect(after.map((i) => i.processorId).sort()).toEqual(transfers.map((t) => t.id).sort());
    // The transfer made in the window is the one the ledger recorded, not a second one.
    expect(after.map((i) => i.processorId)).toContain(made.data[0].id);
    for (const t of transfers) expect(t.amount).toBe(after.find((i) => i.processorId === t.id)!.amountMinor);

    await expectBooksBalanced();
  }, 120_000);

  it('finishes an auto-accept job cut off in its transfer: the job is done and the payee paid once', async () => {
    const bookingId = insertBooking(db, { songwriterId: songwriter.id, drummerId: drummer.id, totalMinor: 20_000 });
    await fundOverHttp(db, paymentsUrl, songwriter, bookingId);
    moveBooking(db, bookingId, ['recording', 'delivered']);
    await fakeControl(paymentsUrl, 'POST', 'responses/hold', { path: '/v1/transfers' });
    // Delivered long ago and never answered: the review window is over, so the job is due at once.
    scheduleAutoAccept(db, bookingId, new Date(Date.now() - 60 * 86_400_000));
    const autoAcceptJob = () => db.select().from(jobs).where(and(eq(jobs.kind, AUTO_ACCEPT_JOB), like(jobs.dedupeKey, `auto-accept:${bookingId}:%`))).get()!;
    const held = await heldTransfers();
    expect(held).toHaveLength(1);
    expect(autoAcceptJob().status).toBe('running');
    await killHard(server);
    await fakeControl(paymentsUrl, 'POST', 'responses/release');
    expect(autoAcceptJob()).toMatchObject({ status: 'running' });

    server = await startApp({ dataDir: data.dir, port: appPort, paymentsPort });
    await waitFor('the booking to be paid out', () => (bookingStatus(db, bookingId) === 'paid_out' ? true : null), 60_000, 200);
    // The job itself is not left running until its lease would have run out.
    const job = await waitFor('the auto-accept job to be done', () => (autoAcceptJob().status === 'done' ? autoAcceptJob() : null), 30_000, 200);
    expect(job.attempts).toBe(2);
    const transfers = (await stripe.transfers.list({ transfer_group: bookingId })).data;
    expect(transfers.map((t) => accounts.get(String(t.destination)))).toEqual([drummer.id]);
    expect(intentsOf(bookingId).filter((i) => i.kind === 'transfer').map((i) => [i.status, i.processorId])).toEqual([['done', transfers[0].id]]);
    await expectBooksBalanced();
  }, 120_000);

  it('releases a booking that an auto-accept run accepted but died before releasing', async () => {
    const bookingId = insertBooking(db, { songwriterId: songwriter.id, drummerId: drummer.id, totalMinor: 18_000 });
    await fundOverHttp(db, paymentsUrl, songwriter, bookingId);
    await killHard(server);
    // What SIGKILL leaves between the job's two transactions: accepted, the clock still running, no outcome,
    // and the job marked running by the dead process.
    moveBooking(db, bookingId, ['recording', 'delivered', 'accepted']);
    scheduleAutoAccept(db, bookingId, new Date(Date.now() - 60 * 86_400_000));
    db.update(jobs).set({ status: 'running', lockedBy: 'the-killed-process', lockedUntil: Date.now() + 3_600_000, attempts: 1 }).where(like(jobs.dedupeKey, `auto-accept:${bookingId}:%`)).run();

    server = await startApp({ dataDir: data.dir, port: appPort, paymentsPort });
    await waitFor('the booking to be paid out', () => (bookingStatus(db, bookingId) === 'paid_out' ? true : null), 60_000, 200);
    const transfers = (await stripe.transfers.list({ transfer_group: bookingId })).data;
    expect(transfers.map((t) => accounts.get(String(t.destination)))).toEqual([drummer.id]);
    await expectBooksBalanced();
  }, 120_000);
});
