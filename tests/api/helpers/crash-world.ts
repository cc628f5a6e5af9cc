// People, bookings and money for the real-process crash tests. The server runs in another process; the
// test reaches it over HTTP and reads (or, for set-up only, writes) the same SQLite file, as an operator
// with the database open would. Set-up shortcuts mirror the in-process helpers in money.ts.
import { join } from 'node:path';
import { eq } from 'drizzle-orm';
import Stripe from 'stripe';
import { openDb, type Db } from '../../../server/db/client';
import { users } from '../../../server/db/schema';
import { createLedger } from '../../../server/features/ledger/ledger.service';
import { ApiClient } from './test-app';
import { SUCCESS_CARD, bookingStatus, type Person } from './money';
import { waitFor } from './processes';

export const openDataDb = (dataDir: string): Db => openDb(join(dataDir, 'kitlane.db'));

/** The processor SDK as the server builds it, pointed at the fake's own process. */
export const stripeAt = (port: number): Stripe => new Stripe('sk_test_kitlane_local', { host: '127.0.0.1', port, protocol: 'http', maxNetworkRetries: 0 });

/**
 * Signs up over HTTP and marks the address confirmed in the database (the crash tests run without a mail
 * catcher; confirming by mail has its own tests). `admin` gives the account the admin role.
 */
export async function crashPerson(base: string, db: Db, who: { email: string; roles: string[]; displayName: string; admin?: boolean }): Promise<Person> {
  const client = new ApiClient(base);
  const res = await client.post('/api/auth/signup', { email: who.email, password: 'a-long-fine-pass-1', displayName: who.displayName, roles: who.roles });
  if (res.status !== 201) throw new Error(`signup failed: ${res.status} ${JSON.stringify(res.body)}`);
  const id = res.body.user.id as string;
  db.update(users).set({ emailVerifiedAt: new Date(), ...(who.admin ? { roles: ['admin'] } : {}) }).where(eq(users.id, id)).run();
  return { client, id, email: who.email };
}

export async function fakeControl(paymentsUrl: string, method: 'GET' | 'POST', path: string, body: Record<string, string> = {}): Promise<any> {
  const res = await fetch(`${paymentsUrl}/_fake/${path}`, { method, headers: { 'content-type': 'application/json' }, body: method === 'POST' ? JSON.stringify(body) : undefined });
  return res.json();
}

/** Checkout over HTTP, pay on the fake, wait for its webhook to fund the booking. */
export async function fundOverHttp(db: Db, paymentsUrl: string, songwriter: Person, bookingId: string): Promise<string> {
  const checkout = await songwriter.client.post(`/api/bookings/${bookingId}/checkout`);
  if (checkout.status !== 201) throw new Error(`checkout failed: ${checkout.status} ${JSON.stringify(checkout.body)}`);
  const sessionId = checkout.body.sessionId as string;
  const paid = await fetch(`${paymentsUrl}/_fake/checkout/${encodeURIComponent(sessionId)}/pay`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card: SUCCESS_CARD }).toString(),
  });
  if (paid.status !== 200) throw new Error(`pay failed: ${paid.status} ${await paid.text()}`);
  await waitFor('the booking to be funded', () => (bookingStatus(db, bookingId) === 'funded' ? true : null), 30_000, 100);
  return sessionId;
}

/** The payee's connected account, onboarded on the fake and refreshed in the app. */
export async function onboardOverHttp(paymentsUrl: string, stripe: Stripe, payee: Person): Promise<string> {
  const link = await payee.client.post('/api/payouts/account/onboarding');
  if (link.status !== 201) throw new Error(`onboarding link failed: ${link.status} ${JSON.stringify(link.body)}`);
  const accounts = await stripe.accounts.list({ limit: 100 });
  const mine = accounts.data.find((a) => a.metadata?.userId === payee.id);
  if (!mine) throw new Error('no connected account for the payee');
  await fakeControl(paymentsUrl, 'POST', `accounts/${mine.id}/complete-onboarding`);
  const refreshed = await payee.client.post('/api/payouts/account/refresh');
  if (!refreshed.body.account?.payoutsEnabled) throw new Error(`payouts not enabled: ${JSON.stringify(refreshed.body)}`);
  return mine.id;
}

/**
 * The books after a crash: every currency sums to zero, no escrow is negative, and the ledger agrees with
 * the processor on its balance and on every transfer and refund.
 */
export async function booksCheck(db: Db, stripe: Stripe): Promise<{ sums: number[]; negativeEscrows: string[]; differences: string[] }> {
  const ledger = createLedger(db);
  const { accounts, totals } = ledger.balances();
  const negativeEscrows = accounts.filter((a) => a.account.startsWith('escrow:') && -a.balance < 0).map((a) => `${a.account} ${a.balance}`);
  const recon = await ledger.reconcile(stripe);
  return { sums: totals.map((t) => t.sum), negativeEscrows, differences: recon.differences };
}
