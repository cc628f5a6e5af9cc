import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHmac } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { startTestApp, type TestApp } from './helpers/test-app';
import { bookingStatus, DECLINED_CARD, fakeControl, fundBooking, insertBooking, moveBooking, onboard, payOnFake, person, waitUntil, type Person } from './helpers/money';
import { bookingPayments, moneyIntents, processedEvents } from '../../server/db/schema';
import { escrowFor } from '../../server/features/payments/escrow.service';
import { recordChangeRequest } from '../../server/features/payments/escrow.service';
import { scheduleAutoAccept, cancelAutoAccept } from '../../server/features/payments/auto-accept';
import { createLedger } from '../../server/features/ledger/ledger.service';
import { MONEY_RULES, serviceFeeFor } from '@shared/money';
import { inTransaction } from '../../server/features/briefs/in-transaction';

let app: TestApp;
let songwriter: Person;
let drummer: Person;
let engineer: Person;
let outsider: Person;
let otherSongwriter: Person;
let admin: Person;

const ledger = () => createLedger(app.db);
const money = (who: Person, id: string) => who.client.get(`/api/bookings/${id}/money`);
const newBooking = (extra: Partial<Parameters<typeof insertBooking>[1]> = {}) => insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id, ...extra });

async function expectBooksBalanced() {
  for (const total of ledger().balances().totals) expect(total.sum).toBe(0);
  const recon = await ledger().reconcile(app.kitlane.ctx.stripe);
  expect(recon.differences).toEqual([]);
}

beforeAll(async () => {
  app = await startTestApp();
  [songwriter, drummer, engineer, outsider, otherSongwriter] = await Promise.all([
    person(app, 'sw@example.test', ['songwriter'], 'Nell Songwriter'),
    person(app, 'dr@example.test', ['drummer'], 'Odo Drummer'),
    person(app, 'eng@example.test', ['engineer'], 'Ivo Engineer'),
    person(app, 'out@example.test', ['drummer', 'engineer'], 'Uma Outsider'),
    person(app, 'sw2@example.test', ['songwriter'], 'Ada Other'),
  ]);
  admin = await person(app, 'admin@example.test', ['songwriter'], 'Ari Admin');
  app.db.$client.prepare(`update users set roles = '["admin"]' where id = ?`).run(admin.id);
  await onboard(app, drummer);
});
afterAll(async () => {
  await app?.close();
});

describe('checkout', () => {
  it('charges the agreed total plus the service fee, grouped under the booking', async () => {
    const id = newBooking({ totalMinor: 30_000 });
    const res = await songwriter.client.post(`/api/bookings/${id}/checkout`);
    expect(res.status).toBe(201);
    expect(res.body.url).toMatch(/\/checkout\/cs_/);
    const session = await app.kitlane.ctx.stripe.checkout.sessions.retrieve(res.body.sessionId);
    expect(session.amount_total).toBe(30_000 + serviceFeeFor(30_000, 'USD'));
    expect(session.amount_total).toBe(31_500); // 5 % of 300.00 = 15.00 (MONEY_RULES.serviceFee)
    expect(session.metadata?.bookingId).toBe(id);
    const paid = await payOnFake(app, res.body.sessionId);
    expect(paid.status).toBe(200);
    const intent = await waitUntil('the payment intent', async () => (await app.kitlane.ctx.stripe.checkout.sessions.retrieve(res.body.sessionId)).payment_intent as string | null);
    expect((await app.kitlane.ctx.stripe.paymentIntents.retrieve(intent)).transfer_group).toBe(id);
  });

  it('hands out the same open checkout on a second click instead of a second session', async () => {
    const id = newBooking();
    const first = await songwriter.client.post(`/api/bookings/${id}/checkout`);
    const second = await songwriter.client.post(`/api/bookings/${id}/checkout`);
    expect(second.body.sessionId).toBe(first.body.sessionId);
    expect(app.db.select().from(bookingPayments).where(eq(bookingPayments.bookingId, id)).all()).toHaveLength(1);
  });

  it('funds the booking from the webhook and books the payment in the ledger', async () => {
    const id = newBooking({ totalMinor: 20_000 });
    await fundBooking(app, songwriter, id);
    const view = (await money(songwriter, id)).body.money;
    expect(view.stage).toBe('funded');
    expect(view.escrowHeldMinor).toBe(20_000);
    expect(view.paidMinor).toBe(21_000);
    expect(view.notice).toMatch(/not a licensed escrow service/);
    await expectBooksBalanced();
  });

  it('keeps the booking payable after a declined card and shows the reason', async () => {
    const id = newBooking();
    const checkout = await songwriter.client.post(`/api/bookings/${id}/checkout`);
    const declined = await payOnFake(app, checkout.body.sessionId, DECLINED_CARD);
    expect(declined.status).toBe(402);
    expect(declined.body.error.decline_code).toBe('generic_decline');
    const view = await waitUntil('the decline to be recorded', async () => {
      const m = (await money(songwriter, id)).body.money;
      return m.payments[0]?.lastError ? m : null;
    });
    expect(view.payments[0].lastError).toMatch(/declined/i);
    expect(view.can.pay).toBe(true);
    expect(bookingStatus(app.db, id)).toBe('awaiting_payment');
    expect((await payOnFake(app, checkout.body.sessionId)).status).toBe(200);
    await waitUntil('funded after the retry', () => bookingStatus(app.db, id) === 'funded');
  });

  it('refuses checkout to the drummer (403), an outsider (404) and for a funded booking (409)', async () => {
    const id = newBooking();
    expect((await drummer.client.post(`/api/bookings/${id}/checkout`)).status).toBe(403);
    const outsiderTry = await otherSongwriter.client.post(`/api/bookings/${id}/checkout`);
    expect(outsiderTry.status).toBe(404);
    expect(outsiderTry.body.error.code).toBe('not_found');
    await fundBooking(app, songwriter, id);
    expect((await songwriter.client.post(`/api/bookings/${id}/checkout`)).status).toBe(409);
  });
});

describe('webhooks', () => {
  it('refuses a body whose signature does not verify', async () => {
    const body = JSON.stringify({ id: 'evt_forged', type: 'checkout.session.completed', data: { object: { id: 'cs_x' } } });
    const t = Math.floor(Date.now() / 1000);
    const forged = createHmac('sha256', 'whsec_wrong').update(`${t}.${body}`).digest('hex');
    const res = await fetch(`${app.url}/api/webhooks/stripe`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': `t=${t},v1=${forged}` }, body });
    expect(res.status).toBe(400);
    expect((await res.json()).error.code).toBe('bad_signature');
  });

  it('changes nothing when every event arrives twice', async () => {
    await fakeControl(app, 'webhooks/mode', { mode: 'twice' });
    try {
      const id = newBooking({ totalMinor: 12_000 });
      await fundBooking(app, songwriter, id);
      await fakeControl(app, 'webhooks/flush');
      await waitUntil('both deliveries', async () => {
        const log = await (await fetch(`${app.payments!.url}/_fake/webhooks/deliveries`)).json();
        return log.data.filter((d: { status?: string }) => d.status !== 'pending').length > 0;
      });
      expect(ledger().bookingLedger(id).transactions).toHaveLength(1);
      expect(ledger().bookingLedger(id).escrowHeldMinor).toBe(12_000);
      await expectBooksBalanced();
    } finally {
      await fakeControl(app, 'webhooks/mode', { mode: 'normal' });
    }
  });

  it('changes nothing when events arrive in reverse order', async () => {
    await fakeControl(app, 'webhooks/mode', { mode: 'reverse' });
    try {
      const id = newBooking({ totalMinor: 13_000 });
      const checkout = await songwriter.client.post(`/api/bookings/${id}/checkout`);
      await payOnFake(app, checkout.body.sessionId, DECLINED_CARD);
      await payOnFake(app, checkout.body.sessionId);
      await fakeControl(app, 'webhooks/flush');
      await waitUntil('funded', () => bookingStatus(app.db, id) === 'funded');
      // The late "payment failed" event reads current state: the paid checkout shows no decline.
      await fakeControl(app, 'webhooks/flush');
      const view = (await money(songwriter, id)).body.money;
      expect(view.payments[0].status).toBe('paid');
      expect(view.payments[0].lastError).toBeNull();
      expect(ledger().bookingLedger(id).transactions).toHaveLength(1);
    } finally {
      await fakeControl(app, 'webhooks/mode', { mode: 'normal' });
    }
  });

  it('records each event id once', () => {
    const ids = app.db.select().from(processedEvents).all().map((e) => e.eventId);
    expect(new Set(ids).size).toBe(ids.length);
    expect(ids.length).toBeGreaterThan(0);
  });
});

describe('release', () => {
  it('transfers each payee their share less commission from the charge and ends paid out', async () => {
    await onboard(app, engineer);
    const id = newBooking({ engineerId: engineer.id, totalMinor: 40_000, engineerShareMinor: 10_000 });
    await fundBooking(app, songwriter, id);
    moveBooking(app.db, id, ['recording', 'delivered']);
    const res = await songwriter.client.post(`/api/bookings/${id}/release`, { reason: 'Sounds great' });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('paid_out');
    const transfers = await app.kitlane.ctx.stripe.transfers.list({ transfer_group: id });
    const amounts = transfers.data.map((t) => t.amount).sort((a, b) => a - b);
    // 10 % commission on 400.00 = 40.00, divided 30/10 by largest remainder: drummer 270.00, engineer 90.00.
    expect(amounts).toEqual([9_000, 27_000]);
    const charge = app.db.select().from(bookingPayments).where(eq(bookingPayments.bookingId, id)).get()!.chargeId;
    expect(transfers.data.every((t) => t.source_transaction === charge)).toBe(true);
    const view = (await money(drummer, id)).body.money;
    expect(view.stage).toBe('paid_out');
    expect(view.receipts.map((r: { amountMinor: number }) => r.amountMinor)).toEqual([27_000]);
    await app.waitForMail(drummer.email, /Paid out/);
    await expectBooksBalanced();
  });

  it('produces one set of transfers when release is clicked twice at once', async () => {
    const id = newBooking({ totalMinor: 25_000 });
    await fundBooking(app, songwriter, id);
    moveBooking(app.db, id, ['recording', 'delivered']);
    const [a, b] = await Promise.all([songwriter.client.post(`/api/bookings/${id}/release`, {}), songwriter.client.post(`/api/bookings/${id}/release`, {})]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const transfers = await app.kitlane.ctx.stripe.transfers.list({ transfer_group: id });
    expect(transfers.data).toHaveLength(1);
    expect(transfers.data[0].amount).toBe(22_500);
    await expectBooksBalanced();
  });

  it('waits visibly for a payee without a payout account and completes when they onboard', async () => {
    const late = await person(app, 'late@example.test', ['drummer'], 'Lou Late');
    const id = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: late.id, totalMinor: 10_000 });
    await fundBooking(app, songwriter, id);
    moveBooking(app.db, id, ['recording', 'delivered']);
    const res = await songwriter.client.post(`/api/bookings/${id}/release`, {});
    expect(res.body.status).toBe('accepted');
    const waiting = (await money(late, id)).body.money;
    expect(waiting.stage).toBe('awaiting_release');
    expect(waiting.payouts[0].status).toBe('waiting_account');
    expect((await late.client.get('/api/payouts/account')).body.account.waiting).toEqual([{ bookingId: id, amountMinor: 9_000, currency: 'USD' }]);
    await app.waitForMail(late.email, /Connect a payout account/);
    await expectBooksBalanced();
    await onboard(app, late);
    await waitUntil('paid out after onboarding', () => bookingStatus(app.db, id) === 'paid_out');
    expect((await app.kitlane.ctx.stripe.transfers.list({ transfer_group: id })).data.map((t) => t.amount)).toEqual([9_000]);
    await expectBooksBalanced();
  });

  it('repairs a crash between the transfer and the ledger write without a second transfer', async () => {
    const id = newBooking({ totalMinor: 18_000 });
    await fundBooking(app, songwriter, id);
    moveBooking(app.db, id, ['recording', 'delivered']);
    const escrow = escrowFor(app.kitlane.ctx);
    escrow.faults.beforeRecord = () => {
      throw new Error('simulated crash after the processor call');
    };
    try {
      const asSongwriter = { id: songwriter.id, email: songwriter.email, displayName: 'Nell Songwriter', roles: ['songwriter'], emailVerified: true, timeZone: 'UTC' };
      // The decision is recorded and the response still comes back: the movement is left for the repair job.
      expect((await escrow.releaseBooking(asSongwriter, id, { reason: 'Accepted' })).status).toBe('accepted');
    } finally {
      delete escrow.faults.beforeRecord;
    }
    expect((await app.kitlane.ctx.stripe.transfers.list({ transfer_group: id })).data).toHaveLength(1);
    expect(app.db.select().from(moneyIntents).where(eq(moneyIntents.bookingId, id)).get()!.status).toBe('pending');
    const before = await ledger().reconcile(app.kitlane.ctx.stripe);
    expect(before.transfers.missingInLedger).toHaveLength(1);
    await escrow.repairIntents();
    const transfers = (await app.kitlane.ctx.stripe.transfers.list({ transfer_group: id })).data;
    expect(transfers).toHaveLength(1);
    expect(bookingStatus(app.db, id)).toBe('paid_out');
    await expectBooksBalanced();
  });

  it('refuses release by the drummer (403) and by an outsider (404)', async () => {
    const id = newBooking();
    await fundBooking(app, songwriter, id);
    moveBooking(app.db, id, ['recording', 'delivered']);
    expect((await drummer.client.post(`/api/bookings/${id}/release`, {})).status).toBe(403);
    expect((await outsider.client.post(`/api/bookings/${id}/release`, {})).status).toBe(404);
    expect((await songwriter.client.post(`/api/bookings/${id}/release`, { reason: 5 })).status).toBe(400);
  });
});

describe('refunds, splits and cancel', () => {
  it('lets an admin refund part, then everything that is left plus the fee', async () => {
    const id = newBooking({ totalMinor: 30_000 });
    await fundBooking(app, songwriter, id);
    expect((await songwriter.client.post(`/api/bookings/${id}/refund`, {})).status).toBe(403);
    expect((await outsider.client.post(`/api/bookings/${id}/refund`, {})).status).toBe(404);
    const part = await admin.client.post(`/api/bookings/${id}/refund`, { amountMinor: 5_000 });
    expect(part.status).toBe(200);
    expect((await money(songwriter, id)).body.money.escrowHeldMinor).toBe(25_000);
    expect((await admin.client.post(`/api/bookings/${id}/refund`, { amountMinor: 25_001 })).status).toBe(400);
    const rest = await admin.client.post(`/api/bookings/${id}/refund`, {});
    expect(rest.body).toEqual({ status: 'cancelled', refundedMinor: 25_000 + 1_500 });
    const refunds = await app.kitlane.ctx.stripe.refunds.list({ limit: 100 });
    const charge = app.db.select().from(bookingPayments).where(eq(bookingPayments.bookingId, id)).get()!.chargeId;
    expect(refunds.data.filter((r) => r.charge === charge).reduce((s, r) => s + r.amount, 0)).toBe(31_500);
    await expectBooksBalanced();
  });

  it('splits a dispute 70/30 so refund, releases and commission add up to the escrow', async () => {
    const id = newBooking({ totalMinor: 33_333 });
    await fundBooking(app, songwriter, id);
    moveBooking(app.db, id, ['recording', 'delivered', 'disputed']);
    expect((await songwriter.client.post(`/api/bookings/${id}/split`, { songwriterPercent: 70 })).status).toBe(403);
    expect((await outsider.client.post(`/api/bookings/${id}/split`, { songwriterPercent: 70 })).status).toBe(404);
    expect((await admin.client.post(`/api/bookings/${id}/split`, { songwriterPercent: 170 })).status).toBe(400);
    const res = await admin.client.post(`/api/bookings/${id}/split`, { songwriterPercent: 70 });
    expect(res.status).toBe(200);
    // 70 % of 333.33 = 233.331 → 233.33 back; 100.00 released; 10 % commission = 10.00; drummer gets 90.00.
    expect(res.body).toEqual({ status: 'settled', refundMinor: 23_333, releasedMinor: 10_000, commissionMinor: 1_000 });
    expect(res.body.refundMinor + res.body.releasedMinor).toBe(33_333);
    expect((await app.kitlane.ctx.stripe.transfers.list({ transfer_group: id })).data.map((t) => t.amount)).toEqual([9_000]);
    const songwriterView = (await money(songwriter, id)).body.money;
    expect(songwriterView.stage).toBe('settled');
    expect(songwriterView.receipts.some((r: { amountMinor: number; title: string }) => r.amountMinor === 23_333 && /Refunded/.test(r.title))).toBe(true);
    await expectBooksBalanced();
  });

  it('cancels before funding from either side, and after funding only when both agree', async () => {
    const early = newBooking();
    await songwriter.client.post(`/api/bookings/${early}/checkout`);
    expect((await outsider.client.post(`/api/bookings/${early}/cancel`)).status).toBe(404);
    const cancelled = await drummer.client.post(`/api/bookings/${early}/cancel`);
    expect(cancelled.body.status).toBe('cancelled');

    const funded = newBooking({ totalMinor: 15_000 });
    await fundBooking(app, songwriter, funded);
    const asked = await songwriter.client.post(`/api/bookings/${funded}/cancel`);
    expect(asked.body).toMatchObject({ status: 'funded', waitingFor: [drummer.id] });
    const agreed = await drummer.client.post(`/api/bookings/${funded}/cancel`);
    expect(agreed.body.status).toBe('cancelled');
    expect((await money(songwriter, funded)).body.money.stage).toBe('refunded');
    await expectBooksBalanced();
  });

  it('refunds a payment that lands after the booking was cancelled', async () => {
    const id = newBooking({ totalMinor: 11_000 });
    const checkout = await songwriter.client.post(`/api/bookings/${id}/checkout`);
    // Cancel in the database only, so the open session is not expired at the processor.
    moveBooking(app.db, id, ['cancelled']);
    await payOnFake(app, checkout.body.sessionId);
    await waitUntil('the stray payment refunded', async () => (await app.kitlane.ctx.stripe.refunds.list({ limit: 100 })).data.some((r) => r.amount === 11_550));
    expect(ledger().bookingLedger(id).escrowHeldMinor).toBe(0);
    await waitUntil('books balanced', async () => (await ledger().reconcile(app.kitlane.ctx.stripe)).ok);
  });
});

describe('add-ons and auto-accept', () => {
  it('asks for an add-on payment for changes beyond the included revisions', async () => {
    const id = newBooking({ totalMinor: 20_000, revisionsIncluded: 1, extraRevisionMinor: 4_000 });
    await fundBooking(app, songwriter, id);
    moveBooking(app.db, id, ['recording', 'delivered', 'changes_requested']);
    const escrow = escrowFor(app.kitlane.ctx);
    inTransaction(app.db, (tx) => recordChangeRequest(tx, id));
    expect(escrow.needsAddOnPayment(id)).toBe(false);
    expect((await songwriter.client.post(`/api/bookings/${id}/add-on/checkout`)).status).toBe(409);
    inTransaction(app.db, (tx) => recordChangeRequest(tx, id));
    expect(escrow.needsAddOnPayment(id)).toBe(true);
    expect((await drummer.client.post(`/api/bookings/${id}/add-on/checkout`)).status).toBe(403);
    expect((await outsider.client.post(`/api/bookings/${id}/add-on/checkout`)).status).toBe(404);
    const addOn = await songwriter.client.post(`/api/bookings/${id}/add-on/checkout`);
    expect(addOn.status).toBe(201);
    const session = await app.kitlane.ctx.stripe.checkout.sessions.retrieve(addOn.body.sessionId);
    expect(session.amount_total).toBe(4_000 + serviceFeeFor(4_000, 'USD'));
    await payOnFake(app, addOn.body.sessionId);
    await waitUntil('add-on paid', () => !escrow.needsAddOnPayment(id));
    expect((await money(songwriter, id)).body.money.escrowHeldMinor).toBe(24_000);
    await expectBooksBalanced();
  });

  it('accepts and releases a delivery left unanswered for the review window', async () => {
    const id = newBooking({ totalMinor: 10_000 });
    await fundBooking(app, songwriter, id);
    moveBooking(app.db, id, ['recording', 'delivered']);
    const deliveredAt = new Date(Date.now() - (MONEY_RULES.reviewWindowDays * 24 + 1) * 3600_000);
    inTransaction(app.db, (tx) => scheduleAutoAccept(tx, id, deliveredAt));
    await waitUntil('auto-accepted and paid out', () => bookingStatus(app.db, id) === 'paid_out', 15_000);
    await expectBooksBalanced();
  });

  it('shows the auto-accept date and stops the clock when a dispute opens', async () => {
    const id = newBooking({ totalMinor: 10_000 });
    await fundBooking(app, songwriter, id);
    moveBooking(app.db, id, ['recording', 'delivered']);
    const deliveredAt = new Date();
    const due = inTransaction(app.db, (tx) => scheduleAutoAccept(tx, id, deliveredAt));
    expect((await money(songwriter, id)).body.money.autoAcceptAt).toBe(due.toISOString());
    expect(due.getTime() - deliveredAt.getTime()).toBe(7 * 24 * 3600_000);
    inTransaction(app.db, (tx) => {
      cancelAutoAccept(tx, id);
    });
    moveBooking(app.db, id, ['disputed']);
    await escrowFor(app.kitlane.ctx).autoAccept(id, due.getTime());
    expect(bookingStatus(app.db, id)).toBe('disputed');
  });
});

describe('who sees money', () => {
  it('shows a booking’s money and ledger to its parties only', async () => {
    const id = newBooking();
    expect((await money(songwriter, id)).status).toBe(200);
    expect((await money(drummer, id)).status).toBe(200);
    expect((await money(outsider, id)).status).toBe(404);
    expect((await otherSongwriter.client.get(`/api/bookings/${id}/ledger`)).status).toBe(404);
    expect((await admin.client.get(`/api/bookings/${id}/ledger`)).status).toBe(200);
    expect((await app.client().get(`/api/bookings/${id}/money`)).status).toBe(401);
  });

  it('keeps the whole ledger and reconciliation to admins', async () => {
    expect((await songwriter.client.get('/api/admin/ledger')).status).toBe(403);
    expect((await drummer.client.get('/api/admin/ledger/reconcile')).status).toBe(403);
    const totals = await admin.client.get('/api/admin/ledger');
    expect(totals.status).toBe(200);
    for (const t of totals.body.ledger.totals) expect(t.sum).toBe(0);
    const recon = await admin.client.get('/api/admin/ledger/reconcile');
    expect(recon.status).toBe(200);
  });

  it('offers payout onboarding to payees only', async () => {
    expect((await songwriter.client.post('/api/payouts/account/onboarding')).status).toBe(403);
    expect((await songwriter.client.get('/api/payouts/account')).status).toBe(403);
    expect((await app.client().post('/api/payouts/account/onboarding')).status).toBe(401);
    const view = await drummer.client.get('/api/payouts/account');
    expect(view.body.account).toMatchObject({ connected: true, payoutsEnabled: true });
  });
});
