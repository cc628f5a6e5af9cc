// Id → label lookups that many features need to turn ids into words on a page (who, which song). Each takes
// a list with repeats and answers one query; an empty list asks nothing.
import { inArray } from 'drizzle-orm';
import type { Db } from './client';
import { bookings, users } from './schema';

type Reader = Pick<Db, 'select'>;

function unique(ids: string[]): string[] {
  return [...new Set(ids)];
}

export function displayNamesById(db: Reader, ids: string[]): Map<string, string> {
  const wanted = unique(ids);
  if (wanted.length === 0) return new Map();
  const rows = db.select({ id: users.id, displayName: users.displayName }).from(users).where(inArray(users.id, wanted)).all();
  return new Map(rows.map((r) => [r.id, r.displayName]));
}

/** A booking is named by the song in its frozen terms. */
export function songTitlesByBookingId(db: Reader, bookingIds: string[]): Map<string, string> {
  const wanted = unique(bookingIds);
  if (wanted.length === 0) return new Map();
  const rows = db.select({ id: bookings.id, terms: bookings.terms }).from(bookings).where(inArray(bookings.id, wanted)).all();
  return new Map(rows.map((r) => [r.id, r.terms.songTitle]));
}
