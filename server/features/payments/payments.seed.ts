// Demo money: a funded booking, a paid-out one and a delivered one whose review clock runs, all made through
// the escrow service and paid on the payment fake (its /_fake pay control and hosted onboarding form).
// The seed runs before the app listens, so webhooks are not in yet: it reads the processor's current
// state itself (syncCheckoutSession), exactly what the webhook handler does when they arrive later.
import { eq } from 'drizzle-orm';
import type { AppContext } from '../../app';
import type { CurrentUser } from '../../auth/middleware';
import { users } from '../../db/schema';
import type { SeedState, SeedStep } from '../../db/seed-steps';
import { briefInputSchema, todayIn } from '@shared/schemas/briefs';
import { quoteInputSchema } from '@shared/schemas/quotes';
import { createBriefsService } from '../briefs/briefs.service';
import { createQuotesService } from '../quotes/quotes.service';
import { transitionBooking } from '../bookings/bookings.service';
import { inTransaction } from '../briefs/in-transaction';
import { escrowFor } from './escrow.service';
import { createPayoutAccounts } from './payout-accounts.service';
import { scheduleAutoAccept } from './auto-accept';

const SUCCESS_CARD = '4242424242424242';

function demoUser(ctx: AppContext, id: string): CurrentUser {
  const row = ctx.db.select().from(users).where(eq(users.id, id)).get();
  if (!row) throw new Error(`demo user ${id} is missing`);
  return { id: row.id, email: row.email, displayName: row.displayName, roles: row.roles, emailVerified: true, timeZone: row.timeZone };
}

/** The fake's test control beside its hosted page: same origin, /_fake/checkout/:id/pay. */
async function payOnFake(sessionUrl: string): Promise<void> {
  const url = new URL(sessionUrl);
  const res = await fetch(`${url.origin}/_fake${url.pathname}/pay`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card: SUCCESS_CARD }).toString(),
  });
  if (!res.ok) throw new Error(`the payment fake refused the demo payment: ${res.status} ${await res.text()}`);
}

async function onboardPayee(ctx: AppContext, user: CurrentUser): Promise<void> {
  const payouts = createPayoutAccounts(ctx);
  const { url } = await payouts.onboardingLink(user);
  // Submitting the hosted onboarding form completes it on the fake.
  const res = await fetch(url, { method: 'POST', redirect: 'manual' });
  if (res.status >= 400) throw new Error(`demo onboarding failed: ${res.status}`);
  await payouts.refresh(user);
}

async function fund(ctx: AppContext, songwriter: CurrentUser, bookingId: string): Promise<void> {
  const escrow = escrowFor(ctx);
  const { url, sessionId } = await escrow.startCheckout(songwriter, bookingId);
  await payOnFake(url);
  if ((await escrow.syncCheckoutSession(sessionId)) !== 'paid') throw new Error(`demo booking ${bookingId} was not funded`);
}

function addDays(date: string, days: number): string {
  const [y, m, d] = date.split('-').map(Number);
  return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
}

type DemoHire = { owner: string; drummer: string; engineer?: string; songTitle: string; currency: 'USD' | 'EUR'; feeMinor: number; style: string };

const HIRES: DemoHire[] = [
  { owner: 'teo', drummer: 'odell', songTitle: 'Night Ferry', currency: 'USD', feeMinor: 25_000, style: 'rock' },
  { owner: 'ines', drummer: 'pim', engineer: 'rune', songTitle: 'Salt Road', currency: 'EUR', feeMinor: 30_000, style: 'indie' },
  { owner: 'teo', drummer: 'juno', songTitle: 'Quiet Harbour', currency: 'USD', feeMinor: 22_000, style: 'folk' },
];

/** A brief, one quote and its acceptance, through the same services people use. */
function hire(ctx: AppContext, state: SeedState, demo: DemoHire): { bookingId: string; owner: CurrentUser } {
  const ids = state.userIds;
  const owner = demoUser(ctx, ids[demo.owner]);
  const briefs = createBriefsService(ctx);
  const quotes = createQuotesService(ctx);
  const brief = briefs.create(
    owner,
    briefInputSchema.parse({
      songTitle: demo.songTitle,
      description: 'A finished demo that needs a real kit instead of programmed drums.',
      drumNotes: 'Steady groove, a lift into the last chorus.',
      style: demo.style,
      tempoBpm: 104,
      timeSignature: '4/4',
      musicalKey: 'A minor',
      lengthBars: 80,
      lengthSeconds: null,
      songCount: 1,
      referenceNotes: 'Natural, not over-compressed.',
      sampleRate: 48000,
      bitDepth: '24',
      stemMode: 'every_mic',
      roughMix: true,
      budgetMinMinor: 10_000,
      budgetMaxMinor: 60_000,
      currency: demo.currency,
      deadline: addDays(todayIn(owner.timeZone), 30),
      needsRoom: !!demo.engineer,
    }),
  );
  briefs.publish(owner, brief.id);
  briefs.invite(owner, brief.id, [ids[demo.drummer]]);
  const engineer = demo.engineer ? { engineerId: ids[demo.engineer], engineerShareMinor: 8_000 } : {};
  const quote = quotes.create(
    demoUser(ctx, ids[demo.drummer]),
    brief.id,
    quoteInputSchema.parse({ perSongFeeMinor: demo.feeMinor, rushFeeMinor: 0, extraRevisionMinor: 3_000, revisionsIncluded: 1, turnaroundDays: 6, rightsTerms: 'buyout', message: 'Glad to play this.', validDays: 14, ...engineer }),
  );
  if (demo.engineer) quotes.engineerResponse(demoUser(ctx, ids[demo.engineer]), quote.id, true);
  const booking = quotes.accept(owner, quote.id);
  return { bookingId: booking.id, owner };
}

export const paymentsSeedStep: SeedStep = {
  name: 'escrow: funded, paid-out and delivered bookings',
  async run(ctx, state) {
    // Demo payments need the fake's test controls; against a real processor the demo stays unpaid.
    if (!ctx.env.START_FAKES || ctx.env.STRIPE_API_URL) return;
    const ids = state.userIds;
    await onboardPayee(ctx, demoUser(ctx, ids.juno));
    await onboardPayee(ctx, demoUser(ctx, ids.odell));
    await onboardPayee(ctx, demoUser(ctx, ids.rune));
    // Pim is left without a payout account, so the demo shows the "connect payouts" prompt.

    // The briefs step's booking stays awaiting payment, so the demo songwriter can try "Pay" on the fake's page.
    const funded = hire(ctx, state, HIRES[2]);
    await fund(ctx, funded.owner, funded.bookingId);

    const paidOut = hire(ctx, state, HIRES[0]);
    await fund(ctx, paidOut.owner, paidOut.bookingId);
    inTransaction(ctx.db, (tx) => {
      transitionBooking(tx, paidOut.bookingId, ['funded'], 'recording');
      transitionBooking(tx, paidOut.bookingId, ['recording'], 'delivered');
    });
    await escrowFor(ctx).releaseBooking(paidOut.owner, paidOut.bookingId, { reason: 'Delivery accepted' });

    const delivered = hire(ctx, state, HIRES[1]);
    await fund(ctx, delivered.owner, delivered.bookingId);
    inTransaction(ctx.db, (tx) => {
      transitionBooking(tx, delivered.bookingId, ['funded'], 'recording');
      transitionBooking(tx, delivered.bookingId, ['recording'], 'delivered');
      scheduleAutoAccept(tx, delivered.bookingId, new Date());
    });
    state.moneyBookingIds = { funded: funded.bookingId, paidOut: paidOut.bookingId, delivered: delivered.bookingId };
  },
};
