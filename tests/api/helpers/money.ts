// Helpers for the money API tests: bookings written straight into the database (the quote and booking
// rules have their own tests), the payment fake's test controls, and waiting for webhooks to land.
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { bookings, briefs, quotes } from '../../../server/db/schema';
import type { Db } from '../../../server/db/client';
import { transitionBooking } from '../../../server/features/bookings/bookings.service';
import type { BookingStatus } from '@shared/schemas/bookings';
import { signUp, type ApiClient, type TestApp } from './test-app';

export type Person = { client: ApiClient; id: string; email: string };

export const SUCCESS_CARD = '4242 4242 4242 4242';
export const DECLINED_CARD = '4000 0000 0000 0002';
export const INSUFFICIENT_FUNDS_CARD = '4000 0000 0000 9995';

export async function person(app: TestApp, email: string, roles: string[], displayName: string): Promise<Person> {
  const { client, user } = await signUp(app, { email, roles, displayName });
  return { client, id: user.id, email };
}

export type BookingSpec = {
  songwriterId: string;
  drummerId: string;
  engineerId?: string | null;
  totalMinor?: number;
  engineerShareMinor?: number;
  currency?: string;
  revisionsIncluded?: number;
  extraRevisionMinor?: number;
  songTitle?: string;
};

/** A booking awaiting payment, as accepting a quote leaves it. */
export function insertBooking(db: Db, spec: BookingSpec): string {
  const now = new Date();
  const totalMinor = spec.totalMinor ?? 30_000;
  const engineerShareMinor = spec.engineerId ? (spec.engineerShareMinor ?? 10_000) : 0;
  const currency = spec.currency ?? 'USD';
  const songTitle = spec.songTitle ?? 'Copper Tide';
  const briefId = randomUUID();
  db.insert(briefs)
    .values({ id: briefId, songwriterId: spec.songwriterId, status: 'hired', songTitle, tempoBpm: 96, budgetMinMinor: 1000, budgetMaxMinor: totalMinor * 2, currency, deadline: '2031-05-01', createdAt: now, updatedAt: now, publishedAt: now })
    .run();
  const quoteId = randomUUID();
  const lineItems = [{ kind: 'per_song' as const, label: 'Per song', unitAmount: totalMinor, quantity: 1 }];
  const revisionsIncluded = spec.revisionsIncluded ?? 1;
  const extraRevisionMinor = spec.extraRevisionMinor ?? 4_000;
  db.insert(quotes)
    .values({ id: quoteId, briefId, drummerId: spec.drummerId, engineerId: spec.engineerId ?? null, status: 'accepted', lineItems, totalMinor, currency, revisionsIncluded, extraRevisionMinor, turnaroundDays: 7, rightsTerms: 'buyout', validUntil: new Date(Date.now() + 86_400_000), createdAt: now, updatedAt: now })
    .run();
  const id = randomUUID();
  db.insert(bookings)
    .values({
      id,
      briefId,
      quoteId,
      songwriterId: spec.songwriterId,
      drummerId: spec.drummerId,
      engineerId: spec.engineerId ?? null,
      terms: {
        songTitle,
        lineItems,
        totalMinor,
        currency,
        revisionsIncluded,
        extraRevisionMinor,
        turnaroundDays: 7,
        recordingDate: null,
        rightsTerms: 'buyout',
        royaltyPoints: null,
        deliverables: { sampleRate: 48000, bitDepth: '24', stemMode: 'every_mic', stemList: [], roughMix: false },
        tempoBpm: 96,
        timeSignature: '4/4',
        lengthBars: null,
        lengthSeconds: 200,
        packageName: null,
      },
      totalMinor,
      currency,
      drummerShareMinor: totalMinor - engineerShareMinor,
      engineerShareMinor,
      createdAt: now,
      updatedAt: now,
    })
    .run();
  return id;
}

export function bookingStatus(db: Db, id: string): BookingStatus {
  return db.select({ status: bookings.status }).from(bookings).where(eq(bookings.id, id)).get()!.status;
}

/** Moves a booking along the delivery path as the delivery feature will (funded → recording → delivered …). */
export function moveBooking(db: Db, id: string, path: BookingStatus[]): void {
  for (const to of path) transitionBooking(db, id, [bookingStatus(db, id)], to);
}

/** Pays a checkout session on the fake without a browser (its documented test control). */
export async function payOnFake(app: TestApp, sessionId: string, card = SUCCESS_CARD): Promise<{ status: number; body: any }> {
  const res = await fetch(`${app.payments!.url}/_fake/checkout/${encodeURIComponent(sessionId)}/pay`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card }).toString(),
  });
  return { status: res.status, body: await res.json() };
}

export async function fakeControl(app: TestApp, path: string, body: Record<string, string> = {}): Promise<any> {
  const res = await fetch(`${app.payments!.url}/_fake/${path}`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  return res.json();
}

export async function waitUntil<T>(what: string, probe: () => T | Promise<T>, timeoutMs = 10_000): Promise<NonNullable<T>> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value as NonNullable<T>;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

/** Checkout + pay on the fake + wait until the webhook funded the booking. */
export async function fundBooking(app: TestApp, songwriter: Person, bookingId: string): Promise<string> {
  const checkout = await songwriter.client.post(`/api/bookings/${bookingId}/checkout`);
  if (checkout.status !== 201) throw new Error(`checkout failed: ${checkout.status} ${JSON.stringify(checkout.body)}`);
  const paid = await payOnFake(app, checkout.body.sessionId);
  if (paid.status !== 200) throw new Error(`pay failed: ${JSON.stringify(paid.body)}`);
  await waitUntil('the booking to be funded', () => bookingStatus(app.db, bookingId) === 'funded');
  return checkout.body.sessionId as string;
}

/** Creates the payee's connected account and completes onboarding on the fake, then refreshes it in the app. */
export async function onboard(app: TestApp, payee: Person): Promise<string> {
  const link = await payee.client.post('/api/payouts/account/onboarding');
  if (link.status !== 201) throw new Error(`onboarding link failed: ${link.status} ${JSON.stringify(link.body)}`);
  const account = await app.kitlane.ctx.stripe.accounts.list({ limit: 100 });
  const mine = account.data.find((a) => a.metadata?.userId === payee.id);
  if (!mine) throw new Error('no connected account for the payee');
  await fakeControl(app, `accounts/${mine.id}/complete-onboarding`);
  const refreshed = await payee.client.post('/api/payouts/account/refresh');
  if (!refreshed.body.account?.payoutsEnabled) throw new Error(`payouts not enabled: ${JSON.stringify(refreshed.body)}`);
  return mine.id;
}
