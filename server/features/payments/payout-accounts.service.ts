// Payees' connected accounts at the processor: created on first onboarding, completed through an Account
// Link on the processor's hosted page, and refreshed from the processor (account.updated or on return).
// When an account becomes able to receive transfers, releases waiting for it go out.
import { eq } from 'drizzle-orm';
import type Stripe from 'stripe';
import type { AppContext } from '../../app';
import { payoutAccounts } from '../../db/schema';
import type { CurrentUser } from '../../auth/middleware';
import { forbidden } from '../../http/app-error';
import { MONEY_NOTICE, type PayoutAccountView } from '@shared/schemas/payments';
import { paymentsRepo as repo } from './payments.repository';
import { escrowFor } from './escrow.service';
import { processorError } from './processor-errors';

const PAYEE_ROLES = ['drummer', 'engineer'];

function flagsOf(account: Stripe.Account) {
  return {
    chargesEnabled: account.charges_enabled === true,
    payoutsEnabled: account.payouts_enabled === true,
    transfersActive: account.capabilities?.transfers === 'active',
    detailsSubmitted: account.details_submitted === true,
  };
}

export function createPayoutAccounts(ctx: AppContext) {
  const { db, stripe, appUrl } = ctx;

  function assertPayee(user: CurrentUser): void {
    if (!user.roles.some((r) => PAYEE_ROLES.includes(r))) throw forbidden('Payout accounts are for drummers and engineers');
  }

  function view(user: CurrentUser): PayoutAccountView {
    const row = repo.payoutAccount(db, user.id);
    const waiting = repo.waitingFor(db, user.id).map((i) => ({ bookingId: i.bookingId, amountMinor: i.amountMinor, currency: i.currency }));
    return { connected: !!row, payoutsEnabled: !!row?.payoutsEnabled && !!row.transfersActive, detailsSubmitted: !!row?.detailsSubmitted, waiting, notice: MONEY_NOTICE };
  }

  async function ensureAccount(user: CurrentUser): Promise<string> {
    const existing = repo.payoutAccount(db, user.id);
    if (existing) return existing.stripeAccountId;
    let account: Stripe.Account;
    try {
      // One account per user, ever: the idempotency key makes a double click create one account.
      account = await stripe.accounts.create(
        { type: 'express', email: user.email, capabilities: { transfers: { requested: true } }, metadata: { userId: user.id } },
        { idempotencyKey: `kitlane:payout-account:${user.id}` },
      );
    } catch (error) {
      throw processorError(error, 'could not open a payout account');
    }
    const now = new Date();
    db.insert(payoutAccounts)
      .values({ userId: user.id, stripeAccountId: account.id, ...flagsOf(account), createdAt: now, updatedAt: now })
      .onConflictDoNothing()
      .run();
    return repo.payoutAccount(db, user.id)!.stripeAccountId;
  }

  /** The processor's hosted onboarding page for this payee (a fresh link each time: links expire). */
  async function onboardingLink(user: CurrentUser): Promise<{ url: string }> {
    assertPayee(user);
    const accountId = await ensureAccount(user);
    try {
      const link = await stripe.accountLinks.create({
        account: accountId,
        type: 'account_onboarding',
        refresh_url: `${appUrl}/account?payouts=refresh#payouts`,
        return_url: `${appUrl}/account?payouts=return#payouts`,
      });
      return { url: link.url };
    } catch (error) {
      throw processorError(error, 'could not start onboarding');
    }
  }

  /** Reads the account's current state from the processor; sends waiting releases once it can be paid. */
  async function refreshByStripeId(accountId: string): Promise<void> {
    const row = repo.payoutAccountByStripeId(db, accountId);
    if (!row) return;
    const account = await stripe.accounts.retrieve(accountId);
    db.update(payoutAccounts).set({ ...flagsOf(account), updatedAt: new Date() }).where(eq(payoutAccounts.userId, row.userId)).run();
    if (flagsOf(account).transfersActive) {
      const escrow = escrowFor(ctx);
      for (const bookingId of new Set(repo.waitingFor(db, row.userId).map((i) => i.bookingId))) await escrow.processBooking(bookingId);
    }
  }

  async function refresh(user: CurrentUser): Promise<PayoutAccountView> {
    assertPayee(user);
    const row = repo.payoutAccount(db, user.id);
    if (row) await refreshByStripeId(row.stripeAccountId);
    return view(user);
  }

  return { view: (user: CurrentUser) => (assertPayee(user), view(user)), onboardingLink, refresh, refreshByStripeId };
}
export type PayoutAccounts = ReturnType<typeof createPayoutAccounts>;
