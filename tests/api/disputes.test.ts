// Disputes (issue 4): either party of a funded booking opens one, the booking freezes, only an admin
// settles it, the money moves through the processor, both sides are told in writing, the audit log keeps it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { startTestApp, type TestApp } from './helpers/test-app';
import { bookingStatus, fundBooking, insertBooking, moveBooking, onboard, person, waitUntil, type BookingSpec, type Person } from './helpers/money';
import { auditLog, autoAccepts, disputes, users } from '../../server/db/schema';
import { createLedger } from '../../server/features/ledger/ledger.service';
import { scheduleAutoAccept } from '../../server/features/payments/auto-accept';
import { escrowFor } from '../../server/features/payments/escrow.service';
import { disputesFor } from '../../server/features/disputes/disputes.feature';
import { inTransaction } from '../../server/features/briefs/in-transaction';

let app: TestApp;
let songwriter: Person;
let drummer: Person;
let engineer: Person;
let outsider: Person;
let admin: Person;

const ledger = () => createLedger(app.db);
const reasonText = 'The stems arrived with a click track printed on every file.';

async function fundedBooking(spec: Partial<BookingSpec> = {}): Promise<string> {
  const id = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id, ...spec });
  await fundBooking(app, songwriter, id);
  return id;
}

async function openDispute(who: Person, bookingId: string, reason = 'technical_problems') {
  return who.client.post(`/api/bookings/${bookingId}/disputes`, { reason, text: reasonText });
}

async function expectBooksBalanced() {
  for (const total of ledger().balances().totals) expect(total.sum).toBe(0);
  const recon = await ledger().reconcile(app.kitlane.ctx.stripe);
  expect(recon.differences).toEqual([]);
}

beforeAll(async () => {
  app = await startTestApp();
  [songwriter, drummer, engineer, outsider] = await Promise.all([
    person(app, 'sw@example.test', ['songwriter'], 'Nell Songwriter'),
    person(app, 'dr@example.test', ['drummer'], 'Odo Drummer'),
    person(app, 'eng@example.test', ['engineer'], 'Ivo Engineer'),
    person(app, 'out@example.test', ['songwriter', 'drummer'], 'Uma Outsider'),
  ]);
  admin = await person(app, 'admin@example.test', ['songwriter'], 'Ari Admin');
  app.db.$client.prepare(`update users set roles = '["admin"]' where id = ?`).run(admin.id);
  await onboard(app, drummer);
  await onboard(app, engineer);
});
afterAll(async () => {
  await app?.close();
});

describe('opening a dispute', () => {
  it('freezes a funded booking: disputed, the auto-accept clock stopped, the other side and the admins told', async () => {
    const id = await fundedBooking({ engineerId: engineer.id, songTitle: 'Freeze Frame' });
    moveBooking(app.db, id, ['recording', 'delivered']);
    inTransaction(app.db, (tx) => scheduleAutoAccept(tx, id, new Date()));
    const res = await openDispute(drummer, id, 'payment_problem');
    expect(res.status).toBe(201);
    expect(res.body.dispute).toMatchObject({ bookingId: id, status: 'open', reason: 'payment_problem', openedBy: { id: drummer.id, role: 'drummer' }, bookingStatusBefore: 'delivered', outcome: null, amounts: null });
    expect(bookingStatus(app.db, id)).toBe('disputed');
    expect(app.db.select().from(autoAccepts).where(eq(autoAccepts.bookingId, id)).get()?.status).toBe('cancelled');
    const toSongwriter = await app.waitForMail(songwriter.email, /Dispute opened on “Freeze Frame”/);
    expect(toSongwriter.text).toContain(reasonText);
    await app.waitForMail(engineer.email, /Dispute opened on “Freeze Frame”/);
    await app.waitForMail(admin.email, /Dispute opened on “Freeze Frame”/);
    // A frozen booking is not released, neither by the songwriter nor by the review-window job.
    const release = await songwriter.client.post(`/api/bookings/${id}/release`, { reason: 'Trying to accept' });
    expect(release.status).toBe(409);
  });

  it('lets each party see the booking’s disputes; outsiders get 404', async () => {
    const id = await fundedBooking();
    const opened = await openDispute(songwriter, id);
    for (const who of [songwriter, drummer]) {
      const list = await who.client.get(`/api/bookings/${id}/disputes`);
      expect(list.status).toBe(200);
      expect(list.body.items.map((d: { id: string }) => d.id)).toEqual([opened.body.dispute.id]);
    }
    expect((await outsider.client.get(`/api/bookings/${id}/disputes`)).status).toBe(404);
    expect((await app.client().get(`/api/bookings/${id}/disputes`)).status).toBe(401);
  });

  it('refuses outsiders (404), an admin who is no party (403), signed-out people (401) and a second dispute (409)', async () => {
    const id = await fundedBooking();
    expect((await openDispute(outsider, id)).status).toBe(404);
    expect((await openDispute(admin, id)).status).toBe(403);
    expect((await app.client().post(`/api/bookings/${id}/disputes`, { reason: 'other', text: reasonText })).status).toBe(401);
    expect((await openDispute(songwriter, id)).status).toBe(201);
    const second = await openDispute(drummer, id);
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('booking_not_disputable');
  });

  it('refuses a booking whose money is not held yet (409) and bad input field by field (400)', async () => {
    const unpaid = insertBooking(app.db, { songwriterId: songwriter.id, drummerId: drummer.id });
    expect((await openDispute(songwriter, unpaid)).status).toBe(409);
    const id = await fundedBooking();
    const bad = await songwriter.client.post(`/api/bookings/${id}/disputes`, { reason: 'bored', text: 'short' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['reason', 'text']);
    expect((await songwriter.client.post(`/api/bookings/${id}/disputes`, { reason: 'other', text: reasonText, status: 'settled' })).status).toBe(400);
    expect(bookingStatus(app.db, id)).toBe('funded');
  });
});

describe('settling a dispute', () => {
  it('splits 70/30 by largest remainder: exact amounts in the preview, the ledger and at the processor', async () => {
    // 33 333 held: 70 % is 23 333.1 and 30 % is 9 999.9, so largest remainder gives 23 333 / 10 000.
    // The payees' 10 000 divides 22 222 : 11 111 → 6 667 / 3 333; commission 10 % = 1 000 → 667 / 333.
    const id = await fundedBooking({ engineerId: engineer.id, totalMinor: 33_333, engineerShareMinor: 11_111, songTitle: 'Seventy Thirty' });
    const disputeId = (await openDispute(songwriter, id, 'not_as_briefed')).body.dispute.id;

    const preview = await admin.client.post(`/api/admin/disputes/${disputeId}/preview`, { outcome: 'split', songwriterPercent: 70 });
    expect(preview.status).toBe(200);
    expect(preview.body.preview).toMatchObject({
      heldMinor: 33_333,
      songwriterMinor: 23_333,
      serviceFeeRefundMinor: 0,
      payeesMinor: 10_000,
      drummer: { gross: 6_667, commission: 667, net: 6_000 },
      engineer: { gross: 3_333, commission: 333, net: 3_000 },
      commissionMinor: 1_000,
      songwriterPercent: 70,
    });

    const settled = await admin.client.post(`/api/admin/disputes/${disputeId}/settle`, {
      outcome: 'split',
      songwriterPercent: 70,
      note: 'Half the stems were unusable; the rest was as briefed.',
      expectedHeldMinor: 33_333,
    });
    expect(settled.status).toBe(200);
    expect(settled.body.dispute).toMatchObject({ status: 'settled', outcome: 'split', amounts: { heldMinor: 33_333, songwriterMinor: 23_333, payeesMinor: 10_000 } });
    expect(bookingStatus(app.db, id)).toBe('settled');

    const view = ledger().bookingLedger(id);
    const split = view.transactions.find((t) => t.memo.startsWith('Split'));
    expect(split?.entries).toEqual(
      expect.arrayContaining([
        { account: `escrow:${id}`, amount: 33_333 },
        { account: 'refunds', amount: -23_333 },
        { account: `payable:${drummer.id}`, amount: -6_000 },
        { account: `payable:${engineer.id}`, amount: -3_000 },
        { account: 'platform:commission', amount: -1_000 },
      ]),
    );
    expect(split?.entries).toHaveLength(5);
    expect(view.escrowHeldMinor).toBe(0);

    const transfers = await app.kitlane.ctx.stripe.transfers.list({ transfer_group: id, limit: 10 });
    expect(transfers.data.map((t) => t.amount).sort((a, b) => a - b)).toEqual([3_000, 6_000]);
    const refunds = (await app.kitlane.ctx.stripe.refunds.list({ limit: 100 })).data.filter((r) => r.metadata?.bookingId === id);
    expect(refunds.map((r) => r.amount)).toEqual([23_333]);
    await expectBooksBalanced();
  });

  it('tells both sides the decision in writing with the amounts, and shows it to them', async () => {
    const id = await fundedBooking({ totalMinor: 20_000, songTitle: 'Written Word' });
    const disputeId = (await openDispute(drummer, id, 'not_delivered')).body.dispute.id;
    const res = await admin.client.post(`/api/admin/disputes/${disputeId}/settle`, { outcome: 'split', refundMinor: 5_000, note: 'The drummer delivered most of the song.' });
    expect(res.status).toBe(200);
    for (const who of [songwriter, drummer]) {
      const mail = await app.waitForMail(who.email, /Dispute on “Written Word” decided: split between the two sides/);
      expect(mail.text).toContain('Refunded to the songwriter: $50.00');
      expect(mail.text).toContain('Released to the drummer: $150.00');
      expect(mail.text).toContain('The drummer delivered most of the song.');
      const seen = await who.client.get(`/api/bookings/${id}/disputes`);
      expect(seen.body.items[0]).toMatchObject({ status: 'settled', outcome: 'split', amounts: { songwriterMinor: 5_000, payeesMinor: 15_000 }, decisionNote: 'The drummer delivered most of the song.' });
    }
  });

  it('refunds all, with the service fee, or releases all; the books balance after each', async () => {
    const refundId = await fundedBooking({ totalMinor: 10_000 });
    const refundDispute = (await openDispute(songwriter, refundId, 'not_delivered')).body.dispute.id;
    const preview = await admin.client.post(`/api/admin/disputes/${refundDispute}/preview`, { outcome: 'refund' });
    // The 5 % service fee on 100.00 is 5.00 (MONEY_RULES.serviceFee) and comes back with a full refund.
    expect(preview.body.preview).toMatchObject({ heldMinor: 10_000, songwriterMinor: 10_000, serviceFeeRefundMinor: 500, payeesMinor: 0 });
    const refunded = await admin.client.post(`/api/admin/disputes/${refundDispute}/settle`, { outcome: 'refund', note: 'Nothing was ever delivered.' });
    expect(refunded.status).toBe(200);
    const refunds = (await app.kitlane.ctx.stripe.refunds.list({ limit: 100 })).data.filter((r) => r.metadata?.bookingId === refundId);
    expect(refunds.reduce((s, r) => s + r.amount, 0)).toBe(10_500);

    const releaseId = await fundedBooking({ totalMinor: 10_000 });
    const releaseDispute = (await openDispute(drummer, releaseId, 'payment_problem')).body.dispute.id;
    const released = await admin.client.post(`/api/admin/disputes/${releaseDispute}/settle`, { outcome: 'release', note: 'The delivery matches the brief.' });
    expect(released.status).toBe(200);
    const transfers = await app.kitlane.ctx.stripe.transfers.list({ transfer_group: releaseId, limit: 10 });
    expect(transfers.data.map((t) => t.amount)).toEqual([9_000]);
    expect([bookingStatus(app.db, refundId), bookingStatus(app.db, releaseId)]).toEqual(['settled', 'settled']);
    await expectBooksBalanced();
  });

  it('lets only admins settle: parties and outsiders get 403, signed-out 401, and nothing moves', async () => {
    const id = await fundedBooking();
    const disputeId = (await openDispute(songwriter, id)).body.dispute.id;
    const body = { outcome: 'refund', note: 'I decide this myself, thank you.' };
    for (const who of [songwriter, drummer, outsider]) {
      expect((await who.client.post(`/api/admin/disputes/${disputeId}/settle`, body)).status).toBe(403);
      expect((await who.client.post(`/api/admin/disputes/${disputeId}/preview`, { outcome: 'refund' })).status).toBe(403);
    }
    expect((await app.client().post(`/api/admin/disputes/${disputeId}/settle`, body)).status).toBe(401);
    expect(bookingStatus(app.db, id)).toBe('disputed');
    // insertBooking's default agreed total, still held.
    expect(ledger().bookingLedger(id).escrowHeldMinor).toBe(30_000);
  });

  it('refuses a second settlement (409), a changed held amount (409) and a split above what is held (400)', async () => {
    const id = await fundedBooking({ totalMinor: 12_000 });
    const disputeId = (await openDispute(songwriter, id)).body.dispute.id;
    const tooMuch = await admin.client.post(`/api/admin/disputes/${disputeId}/settle`, { outcome: 'split', refundMinor: 12_001, note: 'More than everything.' });
    expect(tooMuch.status).toBe(400);
    expect(tooMuch.body.error.fields).toHaveProperty('refundMinor');
    const stale = await admin.client.post(`/api/admin/disputes/${disputeId}/settle`, { outcome: 'release', note: 'Release it all now.', expectedHeldMinor: 11_000 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('held_changed');
    const both = await admin.client.post(`/api/admin/disputes/${disputeId}/settle`, { outcome: 'split', refundMinor: 1, songwriterPercent: 5, note: 'Two answers at once.' });
    expect(both.status).toBe(400);
    expect((await admin.client.post(`/api/admin/disputes/${disputeId}/settle`, { outcome: 'release', note: 'Release it all now.' })).status).toBe(200);
    const again = await admin.client.post(`/api/admin/disputes/${disputeId}/settle`, { outcome: 'refund', note: 'Changed my mind.' });
    expect(again.status).toBe(409);
    expect((await app.kitlane.ctx.stripe.transfers.list({ transfer_group: id, limit: 10 })).data).toHaveLength(1);
  });

  it('records the settlement and its money action in the audit log, with the amounts', async () => {
    const id = await fundedBooking({ totalMinor: 15_000 });
    const disputeId = (await openDispute(songwriter, id)).body.dispute.id;
    await admin.client.post(`/api/admin/disputes/${disputeId}/settle`, { outcome: 'split', songwriterPercent: 40, note: 'Shared blame for the late delivery.' });
    const rows = app.db.select().from(auditLog).all().filter((r) => r.targetId === disputeId || r.targetId === id);
    expect(rows.map((r) => [r.action, r.targetType, r.actorId]).sort()).toEqual([
      ['settle', 'dispute', admin.id],
      ['split', 'booking', admin.id],
    ]);
    expect(rows[0].amounts).toEqual({ currency: 'USD', heldMinor: 15_000, songwriterMinor: 6_000, payeesMinor: 9_000 });
  });

  it('finishes a settlement a crash left after the processor call, without moving the money twice', async () => {
    const id = await fundedBooking({ totalMinor: 18_000 });
    const disputeId = (await openDispute(songwriter, id)).body.dispute.id;
    // The decision was written and the escrow service ran, then the process died before the record.
    app.db
      .update(disputes)
      .set({ outcome: 'split', heldMinor: 18_000, songwriterMinor: 9_000, feeRefundMinor: 0, payeesMinor: 9_000, decidedBy: admin.id, decisionNote: 'Even split after a crash.', decidedAt: new Date() })
      .where(eq(disputes.id, disputeId))
      .run();
    await escrowFor(app.kitlane.ctx).splitBooking({ kind: 'system' }, id, { refundMinor: 9_000, reason: 'Dispute decision' });
    await disputesFor(app.kitlane.ctx).finishPending();
    const row = app.db.select().from(disputes).where(eq(disputes.id, disputeId)).get()!;
    expect(row.status).toBe('settled');
    const refunds = (await app.kitlane.ctx.stripe.refunds.list({ limit: 100 })).data.filter((r) => r.metadata?.bookingId === id);
    expect(refunds.map((r) => r.amount)).toEqual([9_000]);
    await waitUntil('the decision mail', () => app.mail?.messages().some((m) => m.subject.includes('decided') && (m.text ?? '').includes('Even split after a crash.')));
    await expectBooksBalanced();
  });
});

describe('the demo seed', () => {
  it('has one open dispute at the desk, one settled 70/30, and reviews on paid-out bookings', async () => {
    const seeded = await startTestApp({ seed: true });
    try {
      const desk = seeded.client();
      expect((await desk.post('/api/auth/login', { email: 'admin@kitlane.test', password: 'kitlane-demo-pass' })).status).toBe(200);
      const open = await desk.get('/api/admin/disputes?status=open');
      expect(open.body.items.map((d: { songTitle: string }) => d.songTitle)).toEqual(['Lamplight Verse']);
      const settled = await desk.get('/api/admin/disputes?status=settled');
      expect(settled.body.items).toEqual([expect.objectContaining({ songTitle: 'Glass Harbour', outcome: 'split', amounts: expect.objectContaining({ heldMinor: 30_000, songwriterMinor: 21_000, payeesMinor: 9_000 }) })]);
      const juno = seeded.db.select().from(users).where(eq(users.email, 'juno@kitlane.test')).get()!;
      const reviews = await desk.get(`/api/drummers/${juno.id}/reviews`);
      expect(reviews.body).toMatchObject({ ratingAvg: 4, ratingCount: 1 });
      const audit = await desk.get('/api/admin/audit');
      expect(audit.body.items.map((e: { action: string }) => e.action).sort()).toEqual(['settle', 'split']);
    } finally {
      await seeded.close();
    }
  }, 120_000);
});
