// Reviews (issue 4): after paid_out the songwriter rates the drummer and the engineer, once per booking
// and person. The drummer's rating figures on the profile change in the same transaction as the review,
// so search never sorts on a count that disagrees with the reviews.
import { randomUUID } from 'node:crypto';
import type { Db } from '../../db/client';
import type { CurrentUser } from '../../auth/middleware';
import { assertCan } from '../../auth/middleware';
import { AppError, conflict, forbidden, notFound } from '../../http/app-error';
import type { Notifications } from '../notifications/notifications.service';
import { can } from '@shared/permissions';
import { roundRating, type BookingReviews, type CreateReviewInput, type ProfileReviews, type ReviewSubjectRole, type ReviewView } from '@shared/schemas/reviews';
import { createReviewsRepository, type ReviewRow } from './reviews.repository';

type BookingRow = NonNullable<ReturnType<ReturnType<typeof createReviewsRepository>['findBooking']>>;

function isParty(booking: BookingRow, userId: string): boolean {
  return booking.songwriterId === userId || booking.drummerId === userId || booking.engineerId === userId;
}

function subjectOf(booking: BookingRow, role: ReviewSubjectRole): string | null {
  return role === 'drummer' ? booking.drummerId : booking.engineerId;
}

function isUniqueViolation(error: unknown): boolean {
  return String((error as { code?: string })?.code ?? error).includes('SQLITE_CONSTRAINT_UNIQUE') || String(error).includes('UNIQUE constraint failed');
}

export function createReviewsService(deps: { db: Db; notifications: Notifications }) {
  const { db, notifications } = deps;
  const repo = createReviewsRepository(db);

  function toViews(rows: ReviewRow[]): ReviewView[] {
    const names = repo.names(rows.flatMap((r) => [r.subjectId, r.reviewerId]));
    const titles = repo.songTitles(rows.map((r) => r.bookingId));
    return rows.map((r) => ({
      id: r.id,
      bookingId: r.bookingId,
      songTitle: titles.get(r.bookingId) ?? '',
      subject: { id: r.subjectId, displayName: names.get(r.subjectId) ?? 'Unknown', role: r.subjectRole },
      reviewer: { id: r.reviewerId, displayName: names.get(r.reviewerId) ?? 'Unknown' },
      rating: r.rating,
      text: r.text,
      createdAt: r.createdAt.toISOString(),
    }));
  }

  /** Who the reader may still review on this booking: only its songwriter, only once paid out. */
  function reviewable(booking: BookingRow, user: CurrentUser, written: ReviewRow[]): ReviewSubjectRole[] {
    if (booking.songwriterId !== user.id || booking.status !== 'paid_out') return [];
    const done = new Set(written.map((r) => r.subjectId));
    const roles: ReviewSubjectRole[] = ['drummer', 'engineer'];
    return roles.filter((role) => {
      const subject = subjectOf(booking, role);
      // Someone who is both drummer and engineer on the booking gets one review, as the drummer.
      if (role === 'engineer' && subject === booking.drummerId) return false;
      return subject !== null && subject !== user.id && !done.has(subject);
    });
  }

  function bookingForReader(user: CurrentUser, bookingId: string): BookingRow {
    const booking = repo.findBooking(bookingId);
    if (!booking || !(isParty(booking, user.id) || can(user.roles, 'read:booking:any'))) throw notFound('That booking');
    return booking;
  }

  return {
    create(user: CurrentUser, bookingId: string, input: CreateReviewInput): ReviewView {
      const booking = bookingForReader(user, bookingId);
      if (booking.songwriterId !== user.id) throw forbidden('Only the songwriter of this booking writes its reviews');
      assertCan(user, 'review:booking:own');
      if (booking.status !== 'paid_out') throw conflict('booking_not_paid_out', 'Reviews open once the booking is paid out');
      const subjectId = subjectOf(booking, input.subjectRole);
      if (!subjectId) throw new AppError('no_engineer', 'This booking had no engineer to review', 400, { subjectRole: 'There was no engineer on this booking' });
      if (input.subjectRole === 'engineer' && subjectId === booking.drummerId) {
        throw new AppError('same_person', 'The drummer was also the engineer: review them once, as the drummer', 400, { subjectRole: 'Review them as the drummer' });
      }
      const id = randomUUID();
      try {
        db.transaction((tx) => {
          repo.insert({ id, bookingId, reviewerId: user.id, subjectId, subjectRole: input.subjectRole, rating: input.rating, text: input.text, createdAt: new Date() }, tx);
          if (input.subjectRole === 'drummer') repo.updateDrummerRating(subjectId, tx);
          notifications.notify(
            subjectId,
            {
              kind: 'booking_update',
              title: `${user.displayName} reviewed you: ${input.rating} of 5`,
              body: input.text,
              link: `/bookings/${bookingId}`,
            },
            tx,
          );
        });
      } catch (error) {
        if (isUniqueViolation(error)) throw conflict('review_exists', 'You already reviewed this person for this booking');
        throw error;
      }
      return toViews(repo.forBooking(bookingId).filter((r) => r.id === id))[0];
    },

    forBooking(user: CurrentUser, bookingId: string): BookingReviews {
      const booking = bookingForReader(user, bookingId);
      const rows = repo.forBooking(bookingId);
      return { items: toViews(rows), canReview: reviewable(booking, user, rows) };
    },

    /** Public, like the profile it belongs to; a disabled account's reviews are gone with its profile. */
    forProfile(personId: string, role: ReviewSubjectRole, limit: number): ProfileReviews {
      const person = repo.findUser(personId);
      if (!person || person.disabledAt || !person.roles.includes(role)) throw notFound(role === 'drummer' ? 'That drummer' : 'That engineer');
      const { count, sum } = repo.stats(personId, role);
      return { items: toViews(repo.forSubject(personId, role, limit)), ratingAvg: roundRating(sum, count), ratingCount: count };
    },
  };
}
export type ReviewsService = ReturnType<typeof createReviewsService>;
