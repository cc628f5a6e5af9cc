// Demo disputes and reviews, made through the services people use: one dispute left open for the admin
// desk, one settled by a 70/30 split, and reviews on paid-out bookings (the payments step's and one here).
// Hires are paid on the payment fake like the payments step does; the seed reads the processor's state
// itself because webhooks only arrive once the app listens.
import { eq } from 'drizzle-orm';
import type { AppContext } from '../../app';
import type { CurrentUser } from '../../auth/middleware';
import { bookings, users } from '../../db/schema';
import type { SeedState, SeedStep } from '../../db/seed-steps';
import { briefInputSchema, todayIn } from '@shared/schemas/briefs';
import { quoteInputSchema } from '@shared/schemas/quotes';
import { createBriefsService } from '../briefs/briefs.service';
import { createQuotesService } from '../quotes/quotes.service';
import { transitionBooking } from '../bookings/bookings.service';
import { inTransaction } from '../briefs/in-transaction';
import { escrowFor } from '../payments/escrow.service';
import { createPayoutAccounts } from '../payments/payout-accounts.service';
import { createReviewsService } from '../reviews/reviews.service';
import { disputesFor } from './disputes.feature';

// The documented success test card (REFERENCES.md, Payments).
const SUCCESS_CARD = '4242424242424242';

function demoUser(ctx: AppContext, id: string): CurrentUser {
  const row = ctx.db.select().from(users).where(eq(users.id, id)).get();
  if (!row) throw new Error(`demo user ${id} is missing`);
  return { id: row.id, email: row.email, displayName: row.displayName, roles: row.roles, emailVerified: true, timeZone: row.timeZone };
}

function addDays(date: string, days: number): string {
  const [y, m, d] = date.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

type DemoHire = { owner: string; drummer: string; songTitle: string; feeMinor: number; style: string };

/** A published brief, one quote, accepted: a booking awaiting payment. */
function hire(ctx: AppContext, state: SeedState, demo: DemoHire): { bookingId: string; owner: CurrentUser } {
  const owner = demoUser(ctx, state.userIds[demo.owner]);
  const drummer = demoUser(ctx, state.userIds[demo.drummer]);
  const briefs = createBriefsService(ctx);
  const quotes = createQuotesService(ctx);
  const brief = briefs.create(
    owner,
    briefInputSchema.parse({
      songTitle: demo.songTitle,
      description: 'Songs recorded at home that need a live kit.',
      drumNotes: 'Keep it simple under the vocal; open up in the outro.',
      style: demo.style,
      tempoBpm: 92,
      timeSignature: '4/4',
      musicalKey: 'G major',
      lengthBars: 72,
      lengthSeconds: null,
      songCount: 1,
      referenceNotes: 'Dry kit, close mics and one room pair.',
      sampleRate: 48000,
      bitDepth: '24',
      stemMode: 'every_mic',
      roughMix: false,
      budgetMinMinor: 10_000,
      budgetMaxMinor: 50_000,
      currency: 'USD',
      deadline: addDays(todayIn(owner.timeZone), 21),
      needsRoom: false,
    }),
  );
  briefs.publish(owner, brief.id);
  briefs.invite(owner, brief.id, [drummer.id]);
  const quote = quotes.create(
    drummer,
    brief.id,
    quoteInputSchema.parse({ perSongFeeMinor: demo.feeMinor, rushFeeMinor: 0, extraRevisionMinor: 2_500, revisionsIncluded: 1, turnaroundDays: 5, rightsTerms: 'credit', message: 'Happy to take this one.', validDays: 14 }),
  );
  return { bookingId: quotes.accept(owner, quote.id).id, owner };
}

async function fund(ctx: AppContext, songwriter: CurrentUser, bookingId: string): Promise<void> {
  const escrow = escrowFor(ctx);
  const { url, sessionId } = await escrow.startCheckout(songwriter, bookingId);
  const page = new URL(url);
  const res = await fetch(`${page.origin}/_fake${page.pathname}/pay`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card: SUCCESS_CARD }).toString(),
  });
  if (!res.ok) throw new Error(`the payment fake refused the demo payment: ${res.status}`);
  if ((await escrow.syncCheckoutSession(sessionId)) !== 'paid') throw new Error(`demo booking ${bookingId} was not funded`);
}

/** Stands in for the delivery feature: the booking is recorded and delivered. */
function deliver(ctx: AppContext, bookingId: string): void {
  inTransaction(ctx.db, (tx) => {
    transitionBooking(tx, bookingId, ['funded'], 'recording');
    transitionBooking(tx, bookingId, ['recording'], 'delivered');
  });
}

async function onboard(ctx: AppContext, user: CurrentUser): Promise<void> {
  const payouts = createPayoutAccounts(ctx);
  const { url } = await payouts.onboardingLink(user);
  const res = await fetch(url, { method: 'POST', redirect: 'manual' });
  if (res.status >= 400) throw new Error(`demo onboarding failed: ${res.status}`);
  await payouts.refresh(user);
}

const statusOf = (ctx: AppContext, id: string) => ctx.db.select({ status: bookings.status }).from(bookings).where(eq(bookings.id, id)).get()?.status;

export const disputesSeedStep: SeedStep = {
  name: 'disputes (one open, one settled) and reviews',
  async run(ctx, state) {
    const ids = state.userIds;
    const disputes = disputesFor(ctx);
    const reviews = createReviewsService(ctx);
    const admin = demoUser(ctx, ids.admin);

    // Open: the songwriter says the stems have problems; the admin desk shows it at the head of the queue. The
    // drummer has a payout account, so whatever the admin decides is transferred at once.
    await onboard(ctx, demoUser(ctx, ids.kofi));
    const open = hire(ctx, state, { owner: 'mara', drummer: 'kofi', songTitle: 'Lamplight Verse', feeMinor: 22_000, style: 'folk' });
    await fund(ctx, open.owner, open.bookingId);
    deliver(ctx, open.bookingId);
    disputes.open(open.owner, open.bookingId, {
      reason: 'technical_problems',
      text: 'Three of the twelve stems end two bars early and the snare bottom mic is silent for the whole song.',
    });

    // Settled: the drummer says the songwriter moved the goalposts; the admin splits 70/30.
    await onboard(ctx, demoUser(ctx, ids.lux));
    const settled = hire(ctx, state, { owner: 'teo', drummer: 'lux', songTitle: 'Glass Harbour', feeMinor: 30_000, style: 'pop' });
    await fund(ctx, settled.owner, settled.bookingId);
    deliver(ctx, settled.bookingId);
    const dispute = disputes.open(demoUser(ctx, ids.lux), settled.bookingId, {
      reason: 'payment_problem',
      text: 'After delivery the brief changed to a different tempo; the songwriter will not accept or pay for the new version.',
    });
    await disputes.settle(admin, dispute.id, { outcome: 'split', songwriterPercent: 70, note: 'The brief changed after delivery; most of the money goes back, the drummer is paid for the work done.' });

    // Reviews on paid-out bookings: the payments step's, and one released here.
    const paidOutByPayments = (state.moneyBookingIds as { paidOut?: string } | undefined)?.paidOut;
    if (paidOutByPayments && statusOf(ctx, paidOutByPayments) === 'paid_out') {
      const row = ctx.db.select().from(bookings).where(eq(bookings.id, paidOutByPayments)).get()!;
      reviews.create(demoUser(ctx, row.songwriterId), row.id, { subjectRole: 'drummer', rating: 5, text: 'Played exactly to the guide and delivered a day early. Clean, well-named stems.' });
    }
    const paid = hire(ctx, state, { owner: 'ines', drummer: 'juno', songTitle: 'Copperleaf', feeMinor: 18_000, style: 'soul' });
    await fund(ctx, paid.owner, paid.bookingId);
    deliver(ctx, paid.bookingId);
    await escrowFor(ctx).releaseBooking(paid.owner, paid.bookingId, { reason: 'Delivery accepted' });
    if (statusOf(ctx, paid.bookingId) !== 'paid_out') throw new Error(`demo booking ${paid.bookingId} was not paid out`);
    reviews.create(paid.owner, paid.bookingId, { subjectRole: 'drummer', rating: 4, text: 'Great feel on the verses; one revision needed for the bridge fill, done quickly.' });
    state.disputeBookingIds = { open: open.bookingId, settled: settled.bookingId, reviewed: paid.bookingId };
  },
};
