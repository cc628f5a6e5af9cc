// Escrow around the payment processor (issue 4): checkout, the webhook's effects, release, refunds,
// splits, cancellation, add-ons and the auto-accept job. Every money step follows the same shape:
//   1. decide in one synchronous transaction: state transition + ledger (escrow → payable/refunds) + intents
//   2. call the processor outside it, with an idempotency key derived from booking, action and version
//   3. record the answer in another transaction (payable/refunds → processor:clearing)
// A job retries step 2–3 for intents left half-way, so a crash never loses or doubles a movement.
import { recordAudit } from '../audit/audit.service';
import { randomUUID } from 'node:crypto';
import type Stripe from 'stripe';
import { and, eq, inArray, sql } from 'drizzle-orm';
import type { AppContext } from '../../app';
import type { Db } from '../../db/client';
import { bookingPayments, bookings, ledgerEntries, ledgerTransactions, moneyIntents } from '../../db/schema';
import type { CurrentUser } from '../../auth/middleware';
import { AppError, conflict, forbidden, notFound } from '../../http/app-error';
import { can } from '@shared/permissions';
import { checkoutTotal, formatMoney, MoneyError, serviceFeeFor } from '@shared/money';
import type { BookingStatus } from '@shared/schemas/bookings';
import type { RefundInput, ReleaseInput, SplitInput } from '@shared/schemas/payments';
import { inTransaction } from '../briefs/in-transaction';
import { transitionBooking } from '../bookings/bookings.service';
import { ACCOUNTS, escrowHeld, postTransaction, type LedgerEntryInput } from '../ledger/ledger.service';
import { allocateAcrossCharges, planOutcome, refundForPercent, type OutcomePlan } from './escrow-rules';
import { paymentsRepo as repo, type BookingRow, type IntentRow, type PaymentRow } from './payments.repository';
import { cancelAutoAccept, markAutoAcceptDone } from './auto-accept';
import { isProcessorUnreachable, processorError } from './processor-errors';

/** Background work (auto-accept, repair) acts as the system, not as a person. */
export const SYSTEM = { kind: 'system' } as const;
export type Actor = CurrentUser | typeof SYSTEM;

const isSystem = (actor: Actor): actor is typeof SYSTEM => 'kind' in actor && actor.kind === 'system';

/** States in which money is held and no outcome has been decided yet. */
const HELD: BookingStatus[] = ['funded', 'recording', 'delivered', 'changes_requested', 'accepted', 'disputed'];
const BEFORE_DELIVERY_DECISION: BookingStatus[] = ['funded', 'recording', 'delivered', 'changes_requested'];

export const REPAIR_JOB = 'payments.repair-intents';
export const PROCESS_JOB = 'payments.process-booking';

type Party = 'songwriter' | 'drummer' | 'engineer';

export function partyOf(row: BookingRow, userId: string): Party | null {
  if (row.songwriterId === userId) return 'songwriter';
  if (row.drummerId === userId) return 'drummer';
  if (row.engineerId === userId) return 'engineer';
  return null;
}

function partiesOf(row: BookingRow): string[] {
  return [row.songwriterId, row.drummerId, ...(row.engineerId ? [row.engineerId] : [])];
}

/** Outsiders get the same 404 as for a booking that does not exist (bookings.service does the same). */
export function loadVisible(tx: Db, actor: Actor, bookingId: string): BookingRow {
  const row = repo.booking(tx, bookingId);
  if (!row) throw notFound('That booking');
  if (isSystem(actor) || partyOf(row, actor.id) || can(actor.roles, 'read:booking:any')) return row;
  throw notFound('That booking');
}

const keyOf = (booking: BookingRow, action: string, ...rest: (string | number)[]) => ['kitlane', 'booking', booking.id, action, `v${booking.version}`, ...rest].join(':');

const lower = (currency: string) => currency.toLowerCase();

function asAppError(error: unknown): never {
  if (error instanceof MoneyError) throw new AppError(error.code, error.message, 400);
  throw error;
}

/** Extra revisions asked for beyond the included ones, not yet paid for. */
export function addOnsOutstanding(tx: Db, bookingId: string): number {
  const booking = repo.booking(tx, bookingId);
  if (!booking || booking.terms.extraRevisionMinor <= 0) return 0;
  const money = repo.moneyOf(tx, bookingId);
  return Math.max(0, money.changeRequests - booking.terms.revisionsIncluded - money.addOnsPaid);
}

/**
 * Counts one request for changes (the delivery engineer calls it in the transaction that moves the
 * booking to changes_requested). Answers how many extra revisions now need paying before work goes on.
 */
export function recordChangeRequest(tx: Db, bookingId: string): { addOnsOutstanding: number } {
  const money = repo.moneyOf(tx, bookingId);
  repo.updateMoney(tx, bookingId, { changeRequests: money.changeRequests + 1 });
  return { addOnsOutstanding: addOnsOutstanding(tx, bookingId) };
}

/** Fees this booking's ledger still credits to the platform (what a full refund gives back). */
function feesKept(tx: Db, bookingId: string): number {
  const row = tx
    .select({ total: sql<number>`coalesce(sum(${ledgerEntries.amount}), 0)` })
    .from(ledgerEntries)
    .innerJoin(ledgerTransactions, eq(ledgerEntries.transactionId, ledgerTransactions.id))
    .where(and(eq(ledgerTransactions.bookingId, bookingId), eq(ledgerEntries.account, ACCOUNTS.fees)))
    .get();
  return -Number(row?.total ?? 0);
}

function entries(list: LedgerEntryInput[]): LedgerEntryInput[] {
  return list.filter((e) => e.amount !== 0);
}

export type EscrowFaults = {
  /** Test seam: runs after the processor answered and before the ledger write (a crash there). */
  beforeRecord?: (intent: IntentRow) => void;
};

export function createEscrowService(ctx: AppContext) {
  const { db, stripe, notifications, logger, appUrl } = ctx;
  const faults: EscrowFaults = {};

  function notifyParties(tx: Db, booking: BookingRow, title: string, body: string, who: string[] = partiesOf(booking)): void {
    for (const userId of new Set(who)) notifications.notify(userId, { kind: 'payment', title, body, link: `/bookings/${booking.id}` }, tx);
  }

  function payeeReady(tx: Db, payeeId: string): boolean {
    return repo.payoutAccount(tx, payeeId)?.transfersActive === true;
  }

  /** Writes the intents for one movement, spread over the booking's charges, and commits the room on them. */
  function createIntents(
    tx: Db,
    booking: BookingRow,
    movement: { kind: 'transfer' | 'refund'; amountMinor: number; payeeId: string | null; keyBase: string; reason: string },
  ): IntentRow[] {
    if (movement.amountMinor === 0) return [];
    const parts = allocateAcrossCharges(movement.amountMinor, repo.chargeRoom(tx, booking.id));
    const status = movement.kind === 'transfer' && movement.payeeId && !payeeReady(tx, movement.payeeId) ? 'waiting_account' : 'pending';
    return parts.map((part) => {
      repo.commitAgainstCharge(tx, part.chargeId, movement.kind, part.amountMinor);
      return tx
        .insert(moneyIntents)
        .values({
          id: randomUUID(),
          bookingId: booking.id,
          kind: movement.kind,
          idempotencyKey: `${movement.keyBase}:${part.chargeId}`,
          payeeId: movement.payeeId,
          chargeId: part.chargeId,
          amountMinor: part.amountMinor,
          currency: booking.currency,
          fromAccount: movement.kind === 'refund' ? ACCOUNTS.refunds : ACCOUNTS.payable(movement.payeeId!),
          status,
          reason: movement.reason,
          createdAt: new Date(),
        })
        .returning()
        .get();
    });
  }

  /**
   * Posts an outcome (release, refund, split, or a partial refund) and writes its intents. `key` makes
   * the whole outcome happen once: a second release click finds it posted and is refused.
   */
  function applyPlan(tx: Db, booking: BookingRow, plan: OutcomePlan, opts: { key: string; memo: string; feeRefundMinor: number; reason: string }): IntentRow[] {
    const refundTotal = plan.refundMinor + opts.feeRefundMinor;
    const posted = postTransaction(tx, {
      memo: opts.memo,
      bookingId: booking.id,
      currency: booking.currency,
      key: opts.key,
      entries: entries([
        { account: ACCOUNTS.escrow(booking.id), amount: plan.heldMinor },
        { account: ACCOUNTS.fees, amount: opts.feeRefundMinor },
        { account: ACCOUNTS.refunds, amount: -refundTotal },
        { account: ACCOUNTS.payable(booking.drummerId), amount: -plan.drummer.net },
        ...(booking.engineerId ? [{ account: ACCOUNTS.payable(booking.engineerId), amount: -plan.engineer.net }] : []),
        { account: ACCOUNTS.commission, amount: -plan.commissionMinor },
      ]),
    });
    if (posted.duplicate) throw conflict('already_decided', 'This money has already been moved');
    const keyBase = opts.key.replace(/^outcome:/, '');
    return [
      ...createIntents(tx, booking, { kind: 'refund', amountMinor: refundTotal, payeeId: null, keyBase: `${keyBase}:refund`, reason: opts.reason }),
      ...createIntents(tx, booking, { kind: 'transfer', amountMinor: plan.drummer.net, payeeId: booking.drummerId, keyBase: `${keyBase}:transfer:${booking.drummerId}`, reason: opts.reason }),
      ...(booking.engineerId
        ? createIntents(tx, booking, { kind: 'transfer', amountMinor: plan.engineer.net, payeeId: booking.engineerId, keyBase: `${keyBase}:transfer:${booking.engineerId}`, reason: opts.reason })
        : []),
    ];
  }

  function tellAboutWaitingPayees(tx: Db, booking: BookingRow, intents: IntentRow[]): void {
    for (const payeeId of new Set(intents.filter((i) => i.status === 'waiting_account').map((i) => i.payeeId!))) {
      notifications.notify(
        payeeId,
        {
          kind: 'payment',
          title: 'Connect a payout account to receive your money',
          body: `Money for "${booking.terms.songTitle}" was released to you. It is transferred as soon as your payout account is set up on your account page.`,
          link: '/account#payouts',
        },
        tx,
      );
    }
  }

  // ── Processor calls for intents ──────────────────────────────────────────────────────────────────

  async function callProcessor(intent: IntentRow): Promise<{ id: string } | 'waiting_account'> {
    if (intent.kind === 'refund') {
      return stripe.refunds.create(
        { charge: intent.chargeId, amount: intent.amountMinor, reason: 'requested_by_customer', metadata: { bookingId: intent.bookingId, intentId: intent.id } },
        { idempotencyKey: intent.idempotencyKey },
      );
    }
    const account = repo.payoutAccount(db, intent.payeeId!);
    if (!account?.transfersActive) return 'waiting_account';
    return stripe.transfers.create(
      {
        amount: intent.amountMinor,
        currency: lower(intent.currency),
        destination: account.stripeAccountId,
        transfer_group: intent.bookingId,
        source_transaction: intent.chargeId,
        metadata: { bookingId: intent.bookingId, intentId: intent.id },
      },
      { idempotencyKey: intent.idempotencyKey },
    );
  }

  function recordIntentDone(intent: IntentRow, processorId: string): void {
    inTransaction(db, (tx) => {
      const current = repo.intent(tx, intent.id);
      if (!current || current.status === 'done') return;
      postTransaction(tx, {
        memo: intent.kind === 'refund' ? 'Refund sent to the songwriter' : 'Transfer sent to the payee',
        bookingId: intent.bookingId,
        currency: intent.currency,
        key: `intent:${intent.id}`,
        externalId: processorId,
        entries: [
          { account: intent.fromAccount, amount: intent.amountMinor },
          { account: ACCOUNTS.clearing, amount: -intent.amountMinor },
        ],
      });
      tx.update(moneyIntents).set({ status: 'done', processorId, doneAt: new Date(), lastError: null }).where(eq(moneyIntents.id, intent.id)).run();
    });
  }

  function recordIntentFailure(intent: IntentRow, error: unknown): void {
    const e = error as { type?: string; statusCode?: number; code?: string; message?: string };
    const message = (e.message ?? String(error)).slice(0, 500);
    const attempts = intent.attempts + 1;
    // A payee whose account lost its transfer capability waits like one without an account.
    if (e.code === 'insufficient_capabilities_for_transfer') {
      db.update(moneyIntents).set({ status: 'waiting_account', attempts, lastError: message }).where(eq(moneyIntents.id, intent.id)).run();
      return;
    }
    // 4xx other than conflicts and rate limits are final: retrying with the same key replays the refusal.
    const final = typeof e.statusCode === 'number' && e.statusCode >= 400 && e.statusCode < 500 && e.statusCode !== 409 && e.statusCode !== 429;
    db.update(moneyIntents).set({ status: final ? 'failed' : 'pending', attempts, lastError: message }).where(eq(moneyIntents.id, intent.id)).run();
    if (final) logger.info(`payment intent ${intent.id} failed: ${message}`);
    else ctx.jobs.enqueue(REPAIR_JOB, {}, { runAt: Date.now() + Math.min(60_000, 500 * 2 ** attempts), dedupeKey: `repair:${intent.id}:${attempts}` });
  }

  /** Calls the processor for one intent and records its answer; safe to run twice (same idempotency key). */
  async function processIntent(intentId: string): Promise<void> {
    let intent = repo.intent(db, intentId);
    if (!intent || intent.status === 'done' || intent.status === 'failed') return;
    if (intent.status === 'waiting_account') {
      if (!payeeReady(db, intent.payeeId!)) return;
      db.update(moneyIntents).set({ status: 'pending' }).where(and(eq(moneyIntents.id, intent.id), eq(moneyIntents.status, 'waiting_account'))).run();
      intent = { ...intent, status: 'pending' };
    }
    let answer: { id: string } | 'waiting_account';
    try {
      answer = await callProcessor(intent);
    } catch (error) {
      recordIntentFailure(intent, error);
      return;
    }
    if (answer === 'waiting_account') {
      db.update(moneyIntents).set({ status: 'waiting_account' }).where(eq(moneyIntents.id, intent.id)).run();
      return;
    }
    faults.beforeRecord?.(intent);
    recordIntentDone(intent, answer.id);
  }

  /** Runs a booking's open intents, then finishes the booking if every transfer went out. */
  async function processBooking(bookingId: string): Promise<void> {
    for (const intent of repo.intents(db, bookingId)) {
      if (intent.status !== 'pending' && intent.status !== 'waiting_account') continue;
      try {
        await processIntent(intent.id);
      } catch (error) {
        // The decision is recorded; the repair job finishes the movement.
        logger.info(`booking ${bookingId}: intent ${intent.id} left for the repair job: ${(error as Error).message}`);
        ctx.jobs.enqueue(REPAIR_JOB, {}, { runAt: Date.now() + 1000 });
      }
    }
    finishIfComplete(bookingId);
  }

  /** A released booking becomes paid_out once every transfer has gone out. */
  function finishIfComplete(bookingId: string): void {
    inTransaction(db, (tx) => {
      const booking = repo.booking(tx, bookingId);
      if (!booking || booking.status !== 'accepted') return;
      if (repo.moneyOf(tx, bookingId).outcome !== 'release') return;
      if (repo.unfinishedTransfers(tx, bookingId) > 0) return;
      const done = transitionBooking(tx, bookingId, ['accepted'], 'paid_out');
      notifyParties(tx, done, 'Paid out', `Everyone's share for "${done.terms.songTitle}" has been transferred. The receipts are on the booking page.`);
    });
  }

  /** Every intent left half-way (after a crash, a network error, or a payee who just finished onboarding). */
  async function repairIntents(): Promise<number> {
    const open = repo.openIntents(db);
    const bookingIds = [...new Set(open.map((i) => i.bookingId))];
    for (const bookingId of bookingIds) await processBooking(bookingId);
    // Bookings whose last transfer was recorded by an earlier run but not finished.
    return open.length;
  }

  // ── Checkout ─────────────────────────────────────────────────────────────────────────────────────

  async function createSession(payment: PaymentRow, booking: BookingRow): Promise<{ url: string; sessionId: string }> {
    const isAddOn = payment.kind === 'add_on';
    const successUrl = `${appUrl}/bookings/${booking.id}?checkout=success&session_id={CHECKOUT_SESSION_ID}`;
    let session: Stripe.Checkout.Session;
    try {
      session = await stripe.checkout.sessions.create(
        {
          mode: 'payment',
          line_items: [
            {
              price_data: {
                currency: lower(payment.currency),
                unit_amount: payment.workMinor / payment.units,
                product_data: { name: isAddOn ? `Extra revision: ${booking.terms.songTitle}` : `Drum tracks: ${booking.terms.songTitle}` },
              },
              quantity: payment.units,
            },
            { price_data: { currency: lower(payment.currency), unit_amount: payment.feeMinor, product_data: { name: 'Kitlane service fee' } }, quantity: 1 },
          ],
          success_url: successUrl,
          cancel_url: `${appUrl}/bookings/${booking.id}?checkout=cancelled`,
          client_reference_id: booking.id,
          metadata: { bookingId: booking.id, paymentId: payment.id, kind: payment.kind },
          payment_intent_data: { transfer_group: booking.id, metadata: { bookingId: booking.id, paymentId: payment.id } },
        },
        { idempotencyKey: payment.idempotencyKey },
      );
    } catch (error) {
      // Unreachable: nothing was charged. The half-made row goes, so the booking reads as before; a retry
      // counts the same attempt number, so its idempotency key (and any session made meanwhile) is the same.
      if (isProcessorUnreachable(error)) {
        db.delete(bookingPayments).where(and(eq(bookingPayments.id, payment.id), eq(bookingPayments.status, 'creating'))).run();
      }
      throw processorError(error, 'did not accept this');
    }
    db.update(bookingPayments).set({ sessionId: session.id, url: session.url, status: 'open' }).where(eq(bookingPayments.id, payment.id)).run();
    return { url: session.url!, sessionId: session.id };
  }

  /** An open checkout of this kind is reused (same page), a half-made one is retried with its key. */
  function reusable(tx: Db, bookingId: string, kind: PaymentRow['kind']): PaymentRow | undefined {
    return repo
      .payments(tx, bookingId)
      .filter((p) => p.kind === kind && (p.status === 'creating' || p.status === 'open'))
      .at(-1);
  }

  async function startCheckout(user: CurrentUser, bookingId: string): Promise<{ url: string; sessionId: string }> {
    const { payment, booking } = inTransaction(db, (tx) => {
      const row = loadVisible(tx, user, bookingId);
      if (row.songwriterId !== user.id || !can(user.roles, 'pay:booking:own')) throw forbidden('Only the songwriter pays for a booking');
      if (row.status !== 'awaiting_payment') throw conflict('booking_state', 'This booking is not awaiting payment');
      const existing = reusable(tx, row.id, 'booking');
      if (existing) return { payment: existing, booking: row };
      let total;
      try {
        total = checkoutTotal(row.totalMinor, row.currency);
      } catch (error) {
        asAppError(error);
      }
      const attempt = repo.payments(tx, row.id).filter((p) => p.kind === 'booking').length + 1;
      const created = tx
        .insert(bookingPayments)
        .values({
          id: randomUUID(),
          bookingId: row.id,
          kind: 'booking',
          idempotencyKey: keyOf(row, 'checkout', `a${attempt}`),
          workMinor: total.agreed,
          feeMinor: total.serviceFee,
          amountMinor: total.total,
          currency: row.currency,
          status: 'creating',
          createdAt: new Date(),
        })
        .returning()
        .get();
      return { payment: created, booking: row };
    });
    if (payment.status === 'open' && payment.url && payment.sessionId) return { url: payment.url, sessionId: payment.sessionId };
    return createSession(payment, booking);
  }

  async function payAddOn(user: CurrentUser, bookingId: string): Promise<{ url: string; sessionId: string }> {
    const { payment, booking } = inTransaction(db, (tx) => {
      const row = loadVisible(tx, user, bookingId);
      if (row.songwriterId !== user.id || !can(user.roles, 'pay:booking:own')) throw forbidden('Only the songwriter pays for extra revisions');
      if (!['delivered', 'changes_requested'].includes(row.status)) throw conflict('booking_state', 'Extra revisions are paid while changes are being asked for');
      const outstanding = addOnsOutstanding(tx, row.id);
      if (outstanding === 0) throw conflict('no_add_on_due', 'No extra revision needs paying: the included revisions cover the changes asked for');
      const existing = reusable(tx, row.id, 'add_on');
      if (existing && existing.units === outstanding) return { payment: existing, booking: row };
      const work = row.terms.extraRevisionMinor * outstanding;
      const fee = serviceFeeFor(work, row.currency);
      const money = repo.moneyOf(tx, row.id);
      const attempt = repo.payments(tx, row.id).filter((p) => p.kind === 'add_on').length + 1;
      const created = tx
        .insert(bookingPayments)
        .values({
          id: randomUUID(),
          bookingId: row.id,
          kind: 'add_on',
          idempotencyKey: keyOf(row, 'add_on', `r${money.changeRequests}`, `a${attempt}`),
          workMinor: work,
          units: outstanding,
          feeMinor: fee,
          amountMinor: work + fee,
          currency: row.currency,
          status: 'creating',
          createdAt: new Date(),
        })
        .returning()
        .get();
      return { payment: created, booking: row };
    });
    if (payment.status === 'open' && payment.url && payment.sessionId) return { url: payment.url, sessionId: payment.sessionId };
    return createSession(payment, booking);
  }

  /** Books a paid checkout: ledger, booking state, mails. A payment that arrives for nothing is refunded. */
  function recordPaid(tx: Db, paymentId: string, intentId: string, chargeId: string): IntentRow[] {
    const payment = repo.payment(tx, paymentId);
    if (!payment || payment.status === 'paid') return [];
    tx.update(bookingPayments).set({ status: 'paid', paymentIntentId: intentId, chargeId, paidAt: new Date(), lastError: null }).where(eq(bookingPayments.id, payment.id)).run();
    const booking = repo.booking(tx, payment.bookingId)!;
    postTransaction(tx, {
      memo: payment.kind === 'add_on' ? 'Extra revision paid' : 'Checkout paid',
      bookingId: booking.id,
      currency: payment.currency,
      key: `charge:${chargeId}`,
      externalId: chargeId,
      entries: entries([
        { account: ACCOUNTS.clearing, amount: payment.amountMinor },
        { account: ACCOUNTS.escrow(booking.id), amount: -payment.workMinor },
        { account: ACCOUNTS.fees, amount: -payment.feeMinor },
      ]),
    });
    const money = repo.moneyOf(tx, booking.id);
    const wanted = payment.kind === 'booking' ? booking.status === 'awaiting_payment' : ['delivered', 'changes_requested', 'recording'].includes(booking.status) && money.outcome === null;
    if (!wanted) return refundStrayPayment(tx, booking, payment, chargeId);
    if (payment.kind === 'booking') {
      const funded = transitionBooking(tx, booking.id, ['awaiting_payment'], 'funded');
      notifyParties(tx, funded, 'Booking funded', `The payment for "${funded.terms.songTitle}" is held until the delivery is accepted. Recording can start.`);
      return [];
    }
    repo.updateMoney(tx, booking.id, { addOnsPaid: money.addOnsPaid + payment.units });
    notifyParties(tx, booking, 'Extra revision paid', `The songwriter paid for ${payment.units} extra revision${payment.units === 1 ? '' : 's'} on "${booking.terms.songTitle}". The changes can be worked on.`);
    return [];
  }

  /** A second payment, or one for a booking cancelled meanwhile: everything of that charge goes back. */
  function refundStrayPayment(tx: Db, booking: BookingRow, payment: PaymentRow, chargeId: string): IntentRow[] {
    postTransaction(tx, {
      memo: 'Payment not needed: refunded in full',
      bookingId: booking.id,
      currency: payment.currency,
      key: `stray:${payment.id}`,
      entries: entries([
        { account: ACCOUNTS.escrow(booking.id), amount: payment.workMinor },
        { account: ACCOUNTS.fees, amount: payment.feeMinor },
        { account: ACCOUNTS.refunds, amount: -payment.amountMinor },
      ]),
    });
    repo.commitAgainstCharge(tx, chargeId, 'refund', payment.amountMinor);
    const intent = tx
      .insert(moneyIntents)
      .values({
        id: randomUUID(),
        bookingId: booking.id,
        kind: 'refund',
        idempotencyKey: `kitlane:payment:${payment.id}:stray-refund`,
        payeeId: null,
        chargeId,
        amountMinor: payment.amountMinor,
        currency: payment.currency,
        fromAccount: ACCOUNTS.refunds,
        status: 'pending',
        reason: 'Paid when no payment was due',
        createdAt: new Date(),
      })
      .returning()
      .get();
    notifyParties(tx, booking, 'Payment refunded', `A payment for "${booking.terms.songTitle}" arrived when none was due; it is refunded in full.`, [booking.songwriterId]);
    return [intent];
  }

  /**
   * Brings one checkout in line with the processor's current state (the webhook handler and the seed call
   * it). Reading current state rather than the event makes repeats and out-of-order events harmless.
   */
  async function syncCheckoutSession(sessionId: string): Promise<'paid' | 'open' | 'expired' | 'unknown'> {
    const session = await stripe.checkout.sessions.retrieve(sessionId, { expand: ['payment_intent'] });
    const paymentId = session.metadata?.paymentId;
    const payment = repo.paymentBySession(db, session.id) ?? (paymentId ? repo.payment(db, paymentId) : undefined);
    if (!payment) return 'unknown';
    if (session.payment_status === 'paid' && session.payment_intent && typeof session.payment_intent !== 'string') {
      const intent = session.payment_intent;
      const chargeId = typeof intent.latest_charge === 'string' ? intent.latest_charge : intent.latest_charge?.id;
      if (!chargeId) return 'open';
      const created = inTransaction(db, (tx) => {
        if (!payment.sessionId) tx.update(bookingPayments).set({ sessionId: session.id }).where(eq(bookingPayments.id, payment.id)).run();
        return recordPaid(tx, payment.id, intent.id, chargeId);
      });
      if (created.length > 0) await processBooking(payment.bookingId);
      return 'paid';
    }
    if (session.status === 'expired') {
      db.update(bookingPayments).set({ status: 'expired' }).where(and(eq(bookingPayments.id, payment.id), inArray(bookingPayments.status, ['creating', 'open']))).run();
      return 'expired';
    }
    return 'open';
  }

  /** A declined attempt: kept on the payment so the booking page can say why (the booking stays payable). */
  function recordDecline(paymentId: string, reason: string): void {
    db.update(bookingPayments).set({ lastError: reason.slice(0, 300) }).where(and(eq(bookingPayments.id, paymentId), inArray(bookingPayments.status, ['creating', 'open']))).run();
  }

  // ── Outcomes ─────────────────────────────────────────────────────────────────────────────────────

  function targetAfterOutcome(booking: BookingRow, fallback: BookingStatus): BookingStatus {
    return booking.status === 'disputed' ? 'settled' : fallback;
  }

  function assertNoOutcome(tx: Db, bookingId: string): void {
    if (repo.moneyOf(tx, bookingId).outcome !== null) throw conflict('already_decided', 'The money of this booking has already been released or refunded');
  }

  async function releaseBooking(actor: Actor, bookingId: string, input: Partial<ReleaseInput> = {}): Promise<{ status: BookingStatus }> {
    const reason = input.reason ?? 'Delivery accepted';
    const booking = inTransaction(db, (tx) => {
      const row = loadVisible(tx, actor, bookingId);
      const admin = !isSystem(actor) && can(actor.roles, 'release:booking:any');
      const songwriter = !isSystem(actor) && row.songwriterId === actor.id;
      if (!isSystem(actor) && !admin && !songwriter) throw forbidden('Only the songwriter (by accepting) or an admin releases the money');
      const allowed: BookingStatus[] = admin ? HELD : ['delivered', 'accepted'];
      if (!allowed.includes(row.status)) throw conflict('booking_state', `A ${row.status.replace('_', ' ')} booking cannot be released`);
      assertNoOutcome(tx, row.id);
      const held = escrowHeld(tx, row.id, row.currency);
      if (held <= 0) throw conflict('nothing_held', 'This booking holds no money to release');
      const moved = row.status === 'accepted' ? row : transitionBooking(tx, row.id, [row.status], targetAfterOutcome(row, 'accepted'));
      let plan: OutcomePlan;
      try {
        plan = planOutcome(held, 0, { drummer: moved.drummerShareMinor, engineer: moved.engineerShareMinor }, moved.currency);
      } catch (error) {
        asAppError(error);
      }
      const intents = applyPlan(tx, moved, plan, { key: `outcome:${moved.id}`, memo: `Released: ${reason}`, feeRefundMinor: 0, reason });
      repo.updateMoney(tx, moved.id, { outcome: 'release' });
      // Dispute settlements write their own audit rows; a direct admin release is audited here.
      if (admin && !songwriter && row.status !== 'disputed') {
        recordAudit(tx, { actorId: actor.id, action: 'release', targetType: 'booking', targetId: row.id, amounts: { heldMinor: held, currency: row.currency }, note: reason });
      }
      cancelAutoAccept(tx, moved.id);
      markAutoAcceptDone(tx, moved.id);
      notifyParties(tx, moved, 'Money released', `The money for "${moved.terms.songTitle}" is released (${reason}). Each payee receives their share less the platform commission.`);
      tellAboutWaitingPayees(tx, moved, intents);
      return moved;
    });
    await processBooking(booking.id);
    return { status: repo.booking(db, booking.id)!.status };
  }

  async function refundBooking(actor: Actor, bookingId: string, input: Partial<RefundInput> & { version?: number } = {}): Promise<{ status: BookingStatus; refundedMinor: number }> {
    const reason = input.reason ?? 'Refund';
    const result = inTransaction(db, (tx) => {
      const row = loadVisible(tx, actor, bookingId);
      if (!isSystem(actor) && !can(actor.roles, 'refund:booking:any')) throw forbidden('Only an admin refunds a funded booking');
      if (!HELD.includes(row.status)) throw conflict('booking_state', `A ${row.status.replace('_', ' ')} booking holds no money to refund`);
      if (input.version !== undefined && input.version !== row.version) throw conflict('stale_booking', 'The booking changed meanwhile; reload and try again');
      assertNoOutcome(tx, row.id);
      const held = escrowHeld(tx, row.id, row.currency);
      const done = input.amountMinor === undefined ? fullRefund(tx, row, held, reason) : partialRefund(tx, row, held, input.amountMinor, reason);
      if (!isSystem(actor) && row.status !== 'disputed') {
        recordAudit(tx, { actorId: actor.id, action: 'refund', targetType: 'booking', targetId: row.id, amounts: { songwriterMinor: done.refundedMinor, heldMinor: held, currency: row.currency }, note: reason });
      }
      return done;
    });
    await processBooking(bookingId);
    return { status: repo.booking(db, bookingId)!.status, refundedMinor: result.refundedMinor };
  }

  function fullRefund(tx: Db, row: BookingRow, held: number, reason: string) {
    const fee = feesKept(tx, row.id);
    const moved = transitionBooking(tx, row.id, [row.status], targetAfterOutcome(row, 'cancelled'));
    const plan = planOutcome(held, held, { drummer: row.drummerShareMinor, engineer: row.engineerShareMinor }, row.currency);
    if (held + fee > 0) applyPlan(tx, moved, plan, { key: `outcome:${moved.id}`, memo: `Refunded in full: ${reason}`, feeRefundMinor: fee, reason });
    repo.updateMoney(tx, moved.id, { outcome: 'refund' });
    cancelAutoAccept(tx, moved.id);
    notifyParties(tx, moved, 'Booking refunded', `Everything paid for "${moved.terms.songTitle}" goes back to the songwriter (${reason}).`);
    return { refundedMinor: held + fee };
  }

  /** Part of the escrow back to the songwriter; the booking goes on with the rest held. */
  function partialRefund(tx: Db, row: BookingRow, held: number, amountMinor: number, reason: string) {
    if (amountMinor > held) throw new AppError('amount_too_large', `At most ${held} minor units are held for this booking`, 400, { amountMinor: `At most ${held}` });
    const plan = planOutcome(held, amountMinor, { drummer: row.drummerShareMinor, engineer: row.engineerShareMinor }, row.currency);
    // Only the refunded part leaves escrow: the rest stays held, so the plan is posted as a refund of `amountMinor` alone.
    const partial: OutcomePlan = { ...plan, heldMinor: amountMinor, releasedMinor: 0, drummer: { gross: 0, commission: 0, net: 0 }, engineer: { gross: 0, commission: 0, net: 0 }, commissionMinor: 0 };
    applyPlan(tx, row, partial, { key: `outcome:${keyOf(row, 'partial-refund')}`, memo: `Partly refunded: ${reason}`, feeRefundMinor: 0, reason });
    // The version moves on so a repeated click with the old version is refused instead of refunding twice.
    tx.update(bookings).set({ version: sql`${bookings.version} + 1`, updatedAt: new Date() }).where(eq(bookings.id, row.id)).run();
    notifyParties(tx, row, 'Part of the payment refunded', `${formatMoney(amountMinor, row.currency)} for "${row.terms.songTitle}" goes back to the songwriter (${reason}).`);
    return { refundedMinor: amountMinor };
  }

  async function splitBooking(actor: Actor, bookingId: string, input: SplitInput): Promise<{ status: BookingStatus; refundMinor: number; releasedMinor: number; commissionMinor: number }> {
    const plan = inTransaction(db, (tx) => {
      const row = loadVisible(tx, actor, bookingId);
      if (!isSystem(actor) && !can(actor.roles, 'settle:dispute:any')) throw forbidden('Only an admin splits a booking');
      if (row.status !== 'disputed') throw conflict('booking_state', 'Only a disputed booking is split');
      assertNoOutcome(tx, row.id);
      const held = escrowHeld(tx, row.id, row.currency);
      let outcome: OutcomePlan;
      try {
        const refund = 'songwriterPercent' in input ? refundForPercent(held, input.songwriterPercent) : input.refundMinor;
        if (refund > held) throw new AppError('amount_too_large', `At most ${held} minor units are held for this booking`, 400, { refundMinor: `At most ${held}` });
        outcome = planOutcome(held, refund, { drummer: row.drummerShareMinor, engineer: row.engineerShareMinor }, row.currency);
      } catch (error) {
        asAppError(error);
      }
      const moved = transitionBooking(tx, row.id, ['disputed'], 'settled');
      const intents = outcome.heldMinor > 0 ? applyPlan(tx, moved, outcome, { key: `outcome:${moved.id}`, memo: `Split: ${input.reason}`, feeRefundMinor: 0, reason: input.reason }) : [];
      repo.updateMoney(tx, moved.id, { outcome: 'split' });
      cancelAutoAccept(tx, moved.id);
      notifyParties(tx, moved, 'Dispute settled by a split', `Of ${formatMoney(held, moved.currency)} held for "${moved.terms.songTitle}", ${formatMoney(outcome.refundMinor, moved.currency)} goes back to the songwriter and ${formatMoney(outcome.releasedMinor, moved.currency)} is released to the payees (less ${formatMoney(outcome.commissionMinor, moved.currency)} commission).`);
      tellAboutWaitingPayees(tx, moved, intents);
      return outcome;
    });
    await processBooking(bookingId);
    return { status: repo.booking(db, bookingId)!.status, refundMinor: plan.refundMinor, releasedMinor: plan.releasedMinor, commissionMinor: plan.commissionMinor };
  }

  /**
   * Before funding either side cancels. After funding an admin cancels with a full refund, or every
   * party asks for it (mutual agreement) and the last request refunds.
   */
  async function cancelBooking(actor: Actor, bookingId: string): Promise<{ status: BookingStatus; cancelRequestedBy: string[]; waitingFor: string[] }> {
    const outcome = inTransaction(db, (tx) => {
      const row = loadVisible(tx, actor, bookingId);
      const admin = !isSystem(actor) && can(actor.roles, 'refund:booking:any');
      const party = isSystem(actor) ? null : partyOf(row, actor.id);
      if (!admin && !party && !isSystem(actor)) throw forbidden('Only the booking’s parties or an admin cancel it');
      if (row.status === 'awaiting_payment') {
        transitionBooking(tx, row.id, ['awaiting_payment'], 'cancelled');
        notifyParties(tx, row, 'Booking cancelled', `"${row.terms.songTitle}" was cancelled before it was paid.`);
        return { refund: false, sessions: repo.payments(tx, row.id).filter((p) => p.status === 'open' && p.sessionId).map((p) => p.sessionId!), requested: [] as string[] };
      }
      if (!BEFORE_DELIVERY_DECISION.includes(row.status)) throw conflict('booking_state', `A ${row.status.replace('_', ' ')} booking cannot be cancelled`);
      assertNoOutcome(tx, row.id);
      if (admin || isSystem(actor)) return { refund: true, sessions: [], requested: [] as string[] };
      const money = repo.moneyOf(tx, row.id);
      const requested = [...new Set([...money.cancelRequestedBy, (actor as CurrentUser).id])];
      repo.updateMoney(tx, row.id, { cancelRequestedBy: requested });
      const agreed = partiesOf(row).every((id) => requested.includes(id));
      if (!agreed) {
        notifyParties(tx, row, 'Cancellation asked for', `${(actor as CurrentUser).displayName} asked to cancel "${row.terms.songTitle}". If everyone agrees, the payment is refunded in full.`, partiesOf(row).filter((id) => !requested.includes(id)));
      }
      return { refund: agreed, sessions: [], requested };
    });
    for (const sessionId of outcome.sessions) {
      // A session paid in the meantime is refunded by the webhook (the booking is cancelled by then).
      await stripe.checkout.sessions.expire(sessionId).catch((error: unknown) => logger.info(`could not expire ${sessionId}: ${(error as Error).message}`));
      inTransaction(db, (tx) => tx.update(bookingPayments).set({ status: 'expired' }).where(and(eq(bookingPayments.sessionId, sessionId), eq(bookingPayments.status, 'open'))).run());
    }
    if (outcome.refund) await refundBooking(SYSTEM, bookingId, { reason: 'Booking cancelled' });
    const after = repo.booking(db, bookingId)!;
    return { status: after.status, cancelRequestedBy: outcome.requested, waitingFor: partiesOf(after).filter((id) => !outcome.requested.includes(id) && after.status !== 'cancelled') };
  }

  /** The auto-accept job: accepts and releases a delivery whose review window ran out untouched. */
  async function autoAccept(bookingId: string, dueAt: number): Promise<void> {
    const due = inTransaction(db, (tx) => {
      const clock = repo.autoAccept(tx, bookingId);
      if (!clock || clock.status !== 'scheduled' || clock.dueAt.getTime() !== dueAt || dueAt > Date.now()) return false;
      const booking = repo.booking(tx, bookingId);
      // Accepted by an earlier run of this job that died before its release: the release is still owed.
      if (booking?.status === 'accepted' && repo.moneyOf(tx, bookingId).outcome === null) return true;
      if (!booking || booking.status !== 'delivered') {
        markAutoAcceptDone(tx, bookingId);
        return false;
      }
      const accepted = transitionBooking(tx, bookingId, ['delivered'], 'accepted');
      notifyParties(tx, accepted, 'Delivery accepted automatically', `The review window for "${accepted.terms.songTitle}" ended without an answer, so the delivery is accepted and the money released.`);
      return true;
    });
    if (due) await releaseBooking(SYSTEM, bookingId, { reason: 'Review window ended without an answer' });
  }

  return {
    faults,
    startCheckout,
    payAddOn,
    syncCheckoutSession,
    recordDecline,
    releaseBooking,
    refundBooking,
    splitBooking,
    cancelBooking,
    autoAccept,
    processBooking,
    repairIntents,
    finishIfComplete,
    needsAddOnPayment: (bookingId: string) => addOnsOutstanding(db, bookingId) > 0,
  };
}
export type EscrowService = ReturnType<typeof createEscrowService>;

const services = new WeakMap<AppContext, EscrowService>();

/** One escrow service per app, shared by routes, jobs, the seed, other features and tests. */
export function escrowFor(ctx: AppContext): EscrowService {
  let service = services.get(ctx);
  if (!service) {
    service = createEscrowService(ctx);
    services.set(ctx, service);
  }
  return service;
}
