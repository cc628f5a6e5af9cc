import { randomUUID } from 'node:crypto';
import { and, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { bookings, type BookingTerms } from '../../db/schema';
import type { CurrentUser } from '../../auth/middleware';
import { conflict, notFound } from '../../http/app-error';
import { can } from '@shared/permissions';
import type { BookingList, BookingStatus, BookingView } from '@shared/schemas/bookings';
import type { BriefRow } from '../briefs/briefs.repository';
import type { QuoteRow } from '../quotes/quotes.repository';
import { createBookingsRepository, type BookingRow } from './bookings.repository';

/** A frozen copy of what was agreed: later edits to the quote, brief or profiles never reach it. */
export function freezeTerms(brief: BriefRow, quote: QuoteRow, packageName: string | null): BookingTerms {
  return {
    songTitle: brief.songTitle,
    lineItems: quote.lineItems.map((i) => ({ ...i })),
    totalMinor: quote.totalMinor,
    currency: quote.currency,
    revisionsIncluded: quote.revisionsIncluded,
    extraRevisionMinor: quote.extraRevisionMinor,
    turnaroundDays: quote.turnaroundDays,
    recordingDate: quote.recordingDate,
    rightsTerms: quote.rightsTerms,
    royaltyPoints: quote.royaltyPoints,
    deliverables: { sampleRate: brief.sampleRate, bitDepth: brief.bitDepth, stemMode: brief.stemMode, stemList: [...brief.stemList], roughMix: brief.roughMix },
    tempoBpm: brief.tempoBpm,
    timeSignature: brief.timeSignature,
    lengthBars: brief.lengthBars,
    lengthSeconds: brief.lengthSeconds,
    packageName,
  };
}

/** Creates the booking for an accepted quote inside the caller's transaction, awaiting payment. */
export function createBookingFromQuote(tx: Db, brief: BriefRow, quote: QuoteRow, extras: { packageName: string | null; inputList: unknown; now: Date }): BookingRow {
  const engineerShareMinor = quote.engineerId ? quote.engineerShareMinor : 0;
  return tx
    .insert(bookings)
    .values({
      id: randomUUID(),
      briefId: brief.id,
      quoteId: quote.id,
      songwriterId: brief.songwriterId,
      drummerId: quote.drummerId,
      engineerId: quote.engineerId,
      status: 'awaiting_payment',
      terms: freezeTerms(brief, quote, extras.packageName),
      totalMinor: quote.totalMinor,
      currency: quote.currency,
      drummerShareMinor: quote.totalMinor - engineerShareMinor,
      engineerShareMinor,
      inputList: extras.inputList ?? null,
      version: 1,
      createdAt: extras.now,
      updatedAt: extras.now,
    })
    .returning()
    .get();
}

/**
 * The one way a booking changes status (money and delivery issues call it inside their transactions).
 * It moves only from one of `from`, bumps `version` (money actions derive idempotency keys from it),
 * and answers 409 when the booking is not in an allowed state, so two racing actions never both apply.
 */
export function transitionBooking(tx: Db, bookingId: string, from: BookingStatus[], to: BookingStatus): BookingRow {
  const row = tx
    .update(bookings)
    .set({ status: to, version: sql`${bookings.version} + 1`, updatedAt: new Date() })
    .where(and(eq(bookings.id, bookingId), inArray(bookings.status, from)))
    .returning()
    .get();
  if (row) return row;
  const current = tx.select({ status: bookings.status }).from(bookings).where(eq(bookings.id, bookingId)).get();
  if (!current) throw notFound('That booking');
  throw conflict('booking_state', `This booking is ${current.status.replace('_', ' ')}; it cannot become ${to.replace('_', ' ')} from there`);
}

function roleIn(row: BookingRow, user: CurrentUser): BookingView['myRole'] | null {
  if (row.songwriterId === user.id) return 'songwriter';
  if (row.drummerId === user.id) return 'drummer';
  if (row.engineerId === user.id) return 'engineer';
  return can(user.roles, 'read:booking:any') ? 'admin' : null;
}

export function createBookingsService(deps: { db: Db }) {
  const repo = createBookingsRepository(deps.db);

  function toViews(rows: BookingRow[], user: CurrentUser): BookingView[] {
    const names = repo.names(rows.flatMap((r) => [r.songwriterId, r.drummerId, ...(r.engineerId ? [r.engineerId] : [])]));
    const party = (id: string) => ({ id, displayName: names.get(id) ?? 'Unknown' });
    return rows.map((r) => ({
      id: r.id,
      briefId: r.briefId,
      quoteId: r.quoteId,
      status: r.status,
      terms: r.terms,
      totalMinor: r.totalMinor,
      currency: r.currency,
      drummerShareMinor: r.drummerShareMinor,
      engineerShareMinor: r.engineerShareMinor,
      songwriter: party(r.songwriterId),
      drummer: party(r.drummerId),
      engineer: r.engineerId ? party(r.engineerId) : null,
      myRole: roleIn(r, user) ?? 'admin',
      version: r.version,
      createdAt: r.createdAt.toISOString(),
      updatedAt: r.updatedAt.toISOString(),
    }));
  }

  return {
    /** Mine as songwriter, drummer or engineer; an admin asking for all gets every booking. */
    list(user: CurrentUser, opts: { all: boolean }): BookingList {
      const rows = opts.all && can(user.roles, 'read:booking:any') ? repo.listAll() : repo.listForParty(user.id);
      const items = toViews(rows, user);
      return { items, total: items.length };
    },

    /** Parties and admins only; everyone else gets the same 404 as for a booking that does not exist. */
    get(user: CurrentUser, id: string): BookingView {
      const row = repo.findById(id);
      if (!row || !roleIn(row, user)) throw notFound('That booking');
      return toViews([row], user)[0];
    },

    toViews,
  };
}
export type BookingsService = ReturnType<typeof createBookingsService>;
