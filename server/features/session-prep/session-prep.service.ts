import { randomUUID } from 'node:crypto';
import type { AppContext } from '../../app';
import type { CurrentUser } from '../../auth/middleware';
import { conflict, forbidden, notFound } from '../../http/app-error';
import { can } from '@shared/permissions';
import type { BookingStatus } from '@shared/schemas/bookings';
import { PREP_ITEMS, type PrepEventView, type PrepItemId, type SessionPrepView } from '@shared/schemas/session-prep';
import { inTransaction } from '../briefs/in-transaction';
import { createSessionPrepRepository, type PrepEventRow } from './session-prep.repository';

/** Prep happens before and between takes; once the songwriter accepted (or the booking ended) the list is a record. */
export const PREP_OPEN_STATUSES: readonly BookingStatus[] = ['awaiting_payment', 'funded', 'recording', 'delivered', 'changes_requested'];

function toEventView(e: PrepEventRow): PrepEventView {
  return { itemId: e.itemId as PrepItemId, done: e.done, by: { id: e.userId, displayName: e.displayName }, at: e.at.toISOString() };
}

export function createSessionPrepService(ctx: Pick<AppContext, 'db'>, clock: () => Date = () => new Date()) {
  const repo = createSessionPrepRepository(ctx.db);

  /** The booking, its room, and what the reader may do; strangers get the same 404 as for no booking. */
  function load(user: CurrentUser, bookingId: string) {
    const booking = repo.booking(bookingId);
    const room = booking ? repo.roomOfQuote(booking.quoteId) : undefined;
    const crew = booking ? [booking.drummerId, booking.engineerId, room?.engineerId].filter((id): id is string => !!id) : [];
    const party = booking && (booking.songwriterId === user.id || crew.includes(user.id) || can(user.roles, 'read:booking:any'));
    if (!booking || !party) throw notFound('That booking');
    return { booking, room, isCrew: crew.includes(user.id) };
  }

  /** Null for a booking without a room: it simply has no checklist (not an error the page should show). */
  function view(user: CurrentUser, bookingId: string): SessionPrepView | null {
    const { booking, room, isCrew } = load(user, bookingId);
    if (!room) return null;
    const history = repo.events(bookingId).map(toEventView);
    const items = PREP_ITEMS.map((item) => {
      const last = history.filter((e) => e.itemId === item.id).at(-1) ?? null;
      return { ...item, done: last?.done ?? false, last };
    });
    return {
      bookingId,
      room: { id: room.id, name: room.name, town: room.town },
      packageName: room.packageName,
      items,
      history,
      canTick: isCrew && PREP_OPEN_STATUSES.includes(booking.status),
      doneCount: items.filter((i) => i.done).length,
    };
  }

  return {
    get: view,

    /** Ticks or unticks one item; a change to the state it already has is not recorded twice. */
    tick(user: CurrentUser, bookingId: string, itemId: PrepItemId, done: boolean): SessionPrepView {
      const { booking, room, isCrew } = load(user, bookingId);
      if (!room) throw notFound('A prep checklist for this booking (it has no room)');
      if (!isCrew) throw forbidden('Only the drummer and the engineer of this booking tick its prep checklist');
      inTransaction(ctx.db, (tx) => {
        const current = repo.booking(bookingId, tx);
        if (!current || !PREP_OPEN_STATUSES.includes(current.status)) {
          throw conflict('booking_state', `This booking is ${(current ?? booking).status.replace('_', ' ')}; its prep checklist is closed`);
        }
        const last = repo.events(bookingId, tx).filter((e) => e.itemId === itemId).at(-1);
        if ((last?.done ?? false) === done) return;
        repo.insertEvent({ id: randomUUID(), bookingId, itemId, done, userId: user.id, at: clock() }, tx);
      });
      return view(user, bookingId)!;
    },
  };
}
export type SessionPrepService = ReturnType<typeof createSessionPrepService>;
