import { randomUUID } from 'node:crypto';
import type { AppContext } from '../../app';
import { assertCan, assertVerified, type CurrentUser } from '../../auth/middleware';
import { AppError, conflict, forbidden, notFound } from '../../http/app-error';
import { can } from '@shared/permissions';
import type { BookingView } from '@shared/schemas/bookings';
import { todayIn } from '@shared/schemas/briefs';
import type { QuoteComparison, QuoteList, QuoteValues, QuoteView } from '@shared/schemas/quotes';
import { inTransaction } from '../briefs/in-transaction';
import { createBriefsRepository } from '../briefs/briefs.repository';
import { loadOwnBrief, loadVisibleBrief } from '../briefs/brief-access';
import { createBookingFromQuote, createBookingsService } from '../bookings/bookings.service';
import { declineWaitingQuotes } from './decline-waiting';
import { resolvePackage } from './packages';
import { buildLineItems, totalOf } from './quote-lines';
import { createQuotesRepository, type QuoteWithNames } from './quotes.repository';
import { blockedReason, effectiveStatus, toQuoteView } from './quotes.view';

const DAY_MS = 86_400_000;
const invalid = (field: string, message: string) => new AppError('invalid_input', message, 400, { [field]: message });

type EngineerPart = { engineerId: string | null; engineerShareMinor: number; packageId: string | null; packageName: string | null };

export function createQuotesService(ctx: Pick<AppContext, 'db' | 'notifications'>, clock: () => Date = () => new Date()) {
  const repo = createQuotesRepository(ctx.db);
  const briefsRepo = createBriefsRepository(ctx.db);
  const bookings = createBookingsService({ db: ctx.db });

  /** The engineer part of a quote: a resolved mic package, or an engineer and share the drummer named. */
  function engineerPartOf(user: CurrentUser, input: QuoteValues, currency: string): EngineerPart {
    if (input.packageId) {
      const pkg = resolvePackage(ctx.db, input.packageId);
      if (!pkg) throw invalid('packageId', 'That mic package was not found');
      if (pkg.currency !== currency) throw invalid('packageId', `That package is priced in ${pkg.currency}; the brief pays in ${currency}`);
      if (pkg.engineerId === user.id) return { engineerId: null, engineerShareMinor: 0, packageId: pkg.id, packageName: pkg.name };
      return { engineerId: pkg.engineerId, engineerShareMinor: pkg.priceMinor, packageId: pkg.id, packageName: pkg.name };
    }
    if (!input.engineerId) return { engineerId: null, engineerShareMinor: 0, packageId: null, packageName: null };
    if (input.engineerId === user.id) throw invalid('engineerId', 'Name another engineer; your own room needs no confirmation');
    const engineer = repo.user(input.engineerId);
    if (!engineer || engineer.disabledAt || !engineer.roles.includes('engineer')) throw invalid('engineerId', 'That person is not an engineer on Kitlane');
    return { engineerId: engineer.id, engineerShareMinor: input.engineerShareMinor ?? 0, packageId: null, packageName: null };
  }

  /** A quote the reader is a party to: its drummer, the brief's owner, the named engineer, or an admin. */
  function loadVisibleQuote(user: CurrentUser, id: string): QuoteWithNames {
    const q = repo.findById(id);
    const party = q && (q.drummerId === user.id || q.songwriterId === user.id || q.engineerId === user.id || user.roles.includes('admin'));
    if (!q || !party) throw notFound('That quote');
    return q;
  }

  function loadOwnersQuote(user: CurrentUser, id: string): QuoteWithNames {
    const q = loadVisibleQuote(user, id);
    if (q.songwriterId !== user.id) throw forbidden('Only the songwriter who wrote the brief can do that');
    return q;
  }

  function assertWaiting(q: QuoteWithNames, now: Date): void {
    const status = effectiveStatus(q, now);
    if (status !== 'sent') throw conflict('quote_not_open', `This quote is ${status}`);
  }

  return {
    create(user: CurrentUser, briefId: string, input: QuoteValues): QuoteView {
      const brief = loadVisibleBrief(briefsRepo, user, briefId);
      if (brief.songwriterId === user.id) throw forbidden('You cannot quote on your own brief');
      assertCan(user, 'create:quote:own', 'Only drummers can send quotes');
      assertVerified(user);
      if (brief.status !== 'open') throw conflict('brief_not_open', `This brief is ${brief.status} and takes no quotes`);
      if (briefsRepo.quoteOf(briefId, user.id)) throw conflict('quote_exists', 'You have already quoted on this brief');
      const now = clock();
      if (input.recordingDate && input.recordingDate < todayIn(user.timeZone, now)) {
        throw invalid('recordingDate', 'Pick a recording date from today on');
      }
      const part = engineerPartOf(user, input, brief.currency);
      const lineItems = buildLineItems({
        perSongFeeMinor: input.perSongFeeMinor,
        songCount: brief.songCount,
        rushFeeMinor: input.rushFeeMinor,
        engineerShareMinor: part.engineerShareMinor,
        packageName: part.packageName,
      });
      const id = randomUUID();
      try {
        inTransaction(ctx.db, (tx) => {
          repo.insert(
            {
              id,
              briefId,
              drummerId: user.id,
              status: 'sent',
              lineItems,
              totalMinor: totalOf(lineItems, brief.currency),
              currency: brief.currency,
              revisionsIncluded: input.revisionsIncluded,
              extraRevisionMinor: input.extraRevisionMinor,
              turnaroundDays: input.turnaroundDays,
              recordingDate: input.recordingDate,
              rightsTerms: input.rightsTerms,
              royaltyPoints: input.rightsTerms === 'points' ? input.royaltyPoints : null,
              message: input.message,
              validUntil: new Date(now.getTime() + input.validDays * DAY_MS),
              packageId: part.packageId,
              engineerId: part.engineerId,
              engineerShareMinor: part.engineerShareMinor,
              engineerStatus: part.engineerId ? 'pending' : 'none',
              createdAt: now,
              updatedAt: now,
            },
            tx,
          );
          ctx.notifications.notify(
            brief.songwriterId,
            {
              kind: 'quote_received',
              title: `New quote from ${user.displayName} for “${brief.songTitle}”`,
              link: `/briefs/${briefId}/quotes`,
              mailParagraphs: [`${user.displayName} sent a quote for “${brief.songTitle}”. Compare it with the others on Kitlane.`],
            },
            tx,
          );
          if (part.engineerId) {
            ctx.notifications.notify(
              part.engineerId,
              {
                kind: 'package_confirm',
                title: `${user.displayName} named you as the engineer on a quote`,
                body: `For “${brief.songTitle}”. Confirm or decline being part of it.`,
                link: `/quotes/${id}`,
                mailParagraphs: [
                  `${user.displayName} quoted on “${brief.songTitle}” with you as the engineer (room and mic package).`,
                  'The songwriter can only accept the quote once you confirm. Open it to confirm or decline.',
                ],
              },
              tx,
            );
          }
        });
      } catch (err) {
        // Two quick submits: the unique index on (brief, drummer) decides.
        if (String(err).includes('UNIQUE')) throw conflict('quote_exists', 'You have already quoted on this brief');
        throw err;
      }
      return toQuoteView(repo.findById(id)!, now);
    },

    /** All quotes on a brief, for its owner only, with what the comparison shows about each drummer. */
    listForBrief(user: CurrentUser, briefId: string): QuoteList<QuoteComparison> {
      loadOwnBrief(briefsRepo, user, briefId);
      const now = clock();
      const rows = repo.listForBrief(briefId);
      const cards = repo.drummerCards(rows.map((r) => r.drummerId));
      const items = rows.map((r) => ({
        ...toQuoteView(r, now),
        drummer: cards.get(r.drummerId) ?? { ratingAvg: null, ratingCount: 0, reelTrackId: null, reelTrackTitle: null },
      }));
      return { items, total: items.length };
    },

    listMine(user: CurrentUser): QuoteList {
      const now = clock();
      const items = repo.listByDrummer(user.id).map((q) => toQuoteView(q, now));
      return { items, total: items.length };
    },

    listEngineerRequests(user: CurrentUser): QuoteList {
      const now = clock();
      const items = repo.listByEngineer(user.id).map((q) => toQuoteView(q, now));
      return { items, total: items.length };
    },

    get(user: CurrentUser, id: string): QuoteView {
      return toQuoteView(loadVisibleQuote(user, id), clock());
    },

    withdraw(user: CurrentUser, id: string): QuoteView {
      const q = loadVisibleQuote(user, id);
      if (q.drummerId !== user.id) throw forbidden('Only the drummer who sent this quote can withdraw it');
      const now = clock();
      assertWaiting(q, now);
      if (!repo.transition(id, ['sent'], { status: 'withdrawn' })) throw conflict('quote_not_open', 'This quote can no longer be withdrawn');
      return toQuoteView(repo.findById(id)!, now);
    },

    decline(user: CurrentUser, id: string, reason: string | undefined): QuoteView {
      const q = loadOwnersQuote(user, id);
      const now = clock();
      assertWaiting(q, now);
      inTransaction(ctx.db, (tx) => {
        if (!repo.transition(id, ['sent'], { status: 'declined', declineReason: reason || null }, tx)) {
          throw conflict('quote_not_open', 'This quote can no longer be declined');
        }
        ctx.notifications.notify(
          q.drummerId,
          {
            kind: 'quote_declined',
            title: `Your quote for “${q.briefTitle}” was declined`,
            body: reason || 'The songwriter gave no reason.',
            link: `/quotes/${id}`,
          },
          tx,
        );
      });
      return toQuoteView(repo.findById(id)!, now);
    },

    /**
     * Accepts one quote in one transaction: the quote is accepted, every other waiting quote is declined
     * (each drummer told), the brief becomes hired, and a booking awaiting payment is created with a frozen
     * copy of the terms. Each step is conditional on the state it expects, so a race loses cleanly (409).
     */
    accept(user: CurrentUser, id: string): BookingView {
      assertCan(user, 'update:brief:own');
      const q = loadOwnersQuote(user, id);
      const now = clock();
      const reason = blockedReason(q, now);
      if (reason) throw conflict('quote_not_acceptable', reason);
      const pkg = q.packageId ? resolvePackage(ctx.db, q.packageId) : null;
      const booking = inTransaction(ctx.db, (tx) => {
        const accepted = repo.transition(id, ['sent'], { status: 'accepted' }, tx);
        if (!accepted) throw conflict('quote_not_acceptable', 'This quote can no longer be accepted');
        const brief = briefsRepo.transition(q.briefId, ['open'], 'hired', {}, tx);
        if (!brief) throw conflict('brief_not_open', 'The brief is no longer open');
        declineWaitingQuotes(tx, ctx.notifications, brief, { reason: 'The songwriter accepted another quote', except: id, now });
        const row = createBookingFromQuote(tx, brief, accepted, { packageName: pkg?.name ?? null, inputList: pkg?.inputList ?? null, now });
        ctx.notifications.notify(
          accepted.drummerId,
          {
            kind: 'quote_accepted',
            title: `Your quote for “${brief.songTitle}” was accepted`,
            body: 'The booking now waits for the songwriter’s payment into escrow.',
            link: `/bookings/${row.id}`,
          },
          tx,
        );
        if (accepted.engineerId) {
          ctx.notifications.notify(
            accepted.engineerId,
            { kind: 'booking_update', title: `A quote you are part of was accepted: “${brief.songTitle}”`, link: `/bookings/${row.id}` },
            tx,
          );
        }
        return row;
      });
      return bookings.toViews([booking], user)[0];
    },

    /** The named engineer confirms or declines being part of the quote; the drummer is told either way. */
    engineerResponse(user: CurrentUser, id: string, confirm: boolean): QuoteView {
      const q = repo.findById(id);
      if (!q || q.engineerId !== user.id) {
        if (q && (q.drummerId === user.id || q.songwriterId === user.id || can(user.roles, 'read:booking:any'))) {
          throw forbidden('Only the engineer named on this quote can answer');
        }
        throw notFound('That quote');
      }
      const now = clock();
      assertWaiting(q, now);
      if (q.engineerStatus !== 'pending') throw conflict('engineer_already_answered', `You already ${q.engineerStatus} this quote`);
      inTransaction(ctx.db, (tx) => {
        if (!repo.transition(id, ['sent'], { engineerStatus: confirm ? 'confirmed' : 'declined' }, tx)) {
          throw conflict('quote_not_open', 'This quote is no longer open');
        }
        ctx.notifications.notify(
          q.drummerId,
          {
            kind: 'package_confirm',
            title: `${user.displayName} ${confirm ? 'confirmed' : 'declined'} being the engineer on your quote`,
            body: confirm ? `The songwriter can now accept your quote for “${q.briefTitle}”.` : `Your quote for “${q.briefTitle}” cannot be accepted as it stands.`,
            link: `/quotes/${id}`,
          },
          tx,
        );
      });
      return toQuoteView(repo.findById(id)!, now);
    },
  };
}
export type QuotesService = ReturnType<typeof createQuotesService>;
