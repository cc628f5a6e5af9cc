// Disputes (issue 4). Opening one freezes the booking (status `disputed`, the auto-accept clock stopped);
// only an admin settles it. Settling follows the money rule of the codebase: the decision is written in a
// transaction, the escrow service moves the money through the processor with its own idempotency keys, and
// a second transaction records the result; a job finishes a settlement a crash left half-way.
import { randomUUID } from 'node:crypto';
import type { Db } from '../../db/client';
import type { CurrentUser } from '../../auth/middleware';
import { assertCan } from '../../auth/middleware';
import { AppError, conflict, forbidden, notFound } from '../../http/app-error';
import type { JobRunner } from '../../jobs/runner';
import type { Logger } from '../../logger';
import type { Notifications } from '../notifications/notifications.service';
import { transitionBooking } from '../bookings/bookings.service';
import { inTransaction } from '../briefs/in-transaction';
import { cancelAutoAccept } from '../payments/auto-accept';
import { SYSTEM, type Actor } from '../payments/escrow.service';
import { ACCOUNTS, createLedger, escrowHeld } from '../ledger/ledger.service';
import { recordAudit } from '../audit/audit.service';
import { can } from '@shared/permissions';
import { formatMoney } from '@shared/money';
import {
  DISPUTABLE_STATUSES,
  DISPUTE_OUTCOME_LABELS,
  DISPUTE_REASON_LABELS,
  type DisputeList,
  type DisputeOutcome,
  type DisputeView,
  type OpenDisputeInput,
  type PreviewSettlementInput,
  type SettleDisputeInput,
  type SettlementPreview,
} from '@shared/schemas/disputes';
import { createDisputesRepository, type DisputeRow } from './disputes.repository';
import { planSettlement } from './settlement-plan';

export const FINISH_SETTLEMENT_JOB = 'disputes.finish-settlement';
/** How long the request itself may take before the job takes over a settlement (processor calls retry inside). */
const FINISH_AFTER_MS = 2 * 60_000;

/**
 * The escrow service's outcome functions (server/features/payments). They move the money through the
 * processor with idempotency keys derived from booking, action and version, and are safe to call again
 * for the same decision.
 */
export type EscrowOutcomes = {
  releaseBooking(actor: Actor, bookingId: string, input: { reason: string }): Promise<unknown>;
  refundBooking(actor: Actor, bookingId: string, input: { amountMinor?: number; reason: string }): Promise<unknown>;
  splitBooking(actor: Actor, bookingId: string, input: { refundMinor: number; reason: string }): Promise<unknown>;
  /** Whether the escrow of the booking already ended (release, refund or split recorded). */
  outcomeOf(bookingId: string): DisputeOutcome | null;
};

type BookingRow = NonNullable<ReturnType<ReturnType<typeof createDisputesRepository>['findBooking']>>;
type PartyRole = DisputeView['openedBy']['role'];

function partyRole(booking: BookingRow, userId: string): PartyRole | null {
  if (booking.songwriterId === userId) return 'songwriter';
  if (booking.drummerId === userId) return 'drummer';
  if (booking.engineerId === userId) return 'engineer';
  return null;
}

function partiesOf(booking: BookingRow): string[] {
  return [...new Set([booking.songwriterId, booking.drummerId, ...(booking.engineerId ? [booking.engineerId] : [])])];
}

const isDisputable = (status: string) => (DISPUTABLE_STATUSES as readonly string[]).includes(status);

/** The decision as plain sentences with the exact amounts: what both sides receive in writing. */
export function decisionParagraphs(plan: SettlementPreview, note: string): string[] {
  const money = (minor: number) => formatMoney(minor, plan.currency);
  const lines = [`Outcome: ${DISPUTE_OUTCOME_LABELS[plan.outcome].toLowerCase()}.`];
  const fee = plan.serviceFeeRefundMinor > 0 ? ` plus the service fee of ${money(plan.serviceFeeRefundMinor)}` : '';
  lines.push(`Refunded to the songwriter: ${money(plan.songwriterMinor)}${fee}.`);
  lines.push(`Released to the drummer: ${money(plan.drummer.gross)} (${money(plan.drummer.net)} after the platform commission of ${money(plan.drummer.commission)}).`);
  if (plan.engineer) lines.push(`Released to the engineer: ${money(plan.engineer.gross)} (${money(plan.engineer.net)} after the platform commission of ${money(plan.engineer.commission)}).`);
  lines.push(`The admin's reasons: ${note}`);
  return lines;
}

export function createDisputesService(deps: { db: Db; notifications: Notifications; jobs: JobRunner; escrow: EscrowOutcomes; logger: Logger }) {
  const { db, notifications, jobs, escrow, logger } = deps;
  const repo = createDisputesRepository(db);
  const ledger = createLedger(db);

  function toViews(rows: DisputeRow[]): DisputeView[] {
    const bookingIds = [...new Set(rows.map((r) => r.bookingId))];
    const titles = repo.songTitles(bookingIds);
    const names = repo.names(rows.map((r) => r.openedBy));
    const roles = new Map(bookingIds.map((id) => [id, repo.findBooking(id)]));
    return rows.map((r) => {
      const booking = roles.get(r.bookingId);
      const decided = r.heldMinor !== null && r.songwriterMinor !== null && r.payeesMinor !== null;
      return {
        id: r.id,
        bookingId: r.bookingId,
        songTitle: titles.get(r.bookingId) ?? '',
        status: r.status,
        settling: r.status === 'open' && r.decidedAt !== null,
        reason: r.reason,
        text: r.text,
        openedBy: { id: r.openedBy, displayName: names.get(r.openedBy) ?? 'Unknown', role: (booking && partyRole(booking, r.openedBy)) ?? 'songwriter' },
        bookingStatusBefore: r.bookingStatusBefore,
        outcome: r.status === 'settled' ? r.outcome : null,
        amounts: r.status === 'settled' && decided ? { currency: r.currency, heldMinor: r.heldMinor!, songwriterMinor: r.songwriterMinor!, serviceFeeRefundMinor: r.feeRefundMinor ?? 0, payeesMinor: r.payeesMinor! } : null,
        decisionNote: r.status === 'settled' ? r.decisionNote : null,
        createdAt: r.createdAt.toISOString(),
        settledAt: r.settledAt?.toISOString() ?? null,
      };
    });
  }

  function bookingForParty(user: CurrentUser, bookingId: string): { booking: BookingRow; role: PartyRole | null } {
    const booking = repo.findBooking(bookingId);
    const role = booking ? partyRole(booking, user.id) : null;
    if (!booking || (!role && !can(user.roles, 'read:booking:any'))) throw notFound('That booking');
    return { booking, role };
  }

  function disputeForAdmin(user: CurrentUser, disputeId: string): { dispute: DisputeRow; booking: BookingRow } {
    assertCan(user, 'settle:dispute:any', 'Only admins settle disputes');
    const dispute = repo.findById(disputeId);
    const booking = dispute && repo.findBooking(dispute.bookingId);
    if (!dispute || !booking) throw notFound('That dispute');
    return { dispute, booking };
  }

  /** The service fee this booking's ledger still credits to the platform (what a full refund gives back). */
  function feesKept(bookingId: string): number {
    const fees = ledger.bookingLedger(bookingId).balances.find((b) => b.account === ACCOUNTS.fees);
    return fees ? -fees.balance : 0;
  }

  function planFor(booking: BookingRow, input: PreviewSettlementInput): SettlementPreview {
    return planSettlement(booking, escrowHeld(db, booking.id, booking.currency), input, feesKept(booking.id));
  }

  /** Records the finished settlement once: dispute settled, booking settled, audit rows, both sides told. */
  function recordSettled(dispute: DisputeRow): void {
    const booking = repo.findBooking(dispute.bookingId)!;
    const plan = planSettlement(booking, dispute.heldMinor ?? 0, toPreviewInput(dispute), dispute.feeRefundMinor ?? 0);
    const now = new Date();
    inTransaction(db, (tx) => {
      if (!repo.markSettled(dispute.id, now, tx)) return;
      // The escrow service may already have moved the booking on; `settled` is where a dispute ends.
      const current = repo.findBooking(dispute.bookingId, tx)!;
      if (current.status !== 'settled') transitionBooking(tx, dispute.bookingId, [current.status], 'settled');
      const amounts = { currency: dispute.currency, heldMinor: plan.heldMinor, songwriterMinor: plan.songwriterMinor + plan.serviceFeeRefundMinor, payeesMinor: plan.payeesMinor };
      recordAudit(tx, { actorId: dispute.decidedBy, action: 'settle', targetType: 'dispute', targetId: dispute.id, amounts, note: dispute.decisionNote ?? '', at: now });
      recordAudit(tx, { actorId: dispute.decidedBy, action: dispute.outcome!, targetType: 'booking', targetId: dispute.bookingId, amounts, note: `Dispute outcome: ${dispute.decisionNote ?? ''}`, at: now });
      const paragraphs = decisionParagraphs(plan, dispute.decisionNote ?? '');
      for (const partyId of partiesOf(booking)) {
        notifications.notify(
          partyId,
          {
            kind: 'dispute',
            title: `Dispute on “${booking.terms.songTitle}” decided: ${DISPUTE_OUTCOME_LABELS[dispute.outcome!].toLowerCase()}`,
            body: paragraphs.slice(0, -1).join(' '),
            link: `/bookings/${booking.id}`,
            mailParagraphs: paragraphs,
          },
          tx,
        );
      }
    });
  }

  /** Moves the money for a decision (idempotent on the escrow side), unless the escrow already ended. */
  async function moveMoney(actor: Actor, dispute: DisputeRow): Promise<void> {
    if (escrow.outcomeOf(dispute.bookingId)) return;
    const reason = `Dispute decision: ${dispute.decisionNote ?? ''}`.slice(0, 500);
    if (dispute.outcome === 'release') await escrow.releaseBooking(actor, dispute.bookingId, { reason });
    else if (dispute.outcome === 'refund') await escrow.refundBooking(actor, dispute.bookingId, { reason });
    else await escrow.splitBooking(actor, dispute.bookingId, { refundMinor: dispute.songwriterMinor ?? 0, reason });
  }

  async function finish(disputeId: string, actor?: CurrentUser): Promise<void> {
    const dispute = repo.findById(disputeId);
    if (!dispute || dispute.status === 'settled' || !dispute.decidedAt) return;
    // The job carries out a decision already taken and audited: it acts as the system, not as the admin.
    await moveMoney(actor ?? SYSTEM, dispute);
    recordSettled(dispute);
  }

  /** Settlements a crash left between the processor call and the record. */
  async function finishPending(): Promise<void> {
    for (const dispute of repo.decidedButUnsettled()) await finish(dispute.id);
  }

  jobs.register(FINISH_SETTLEMENT_JOB, async (payload: { disputeId?: string }) => {
    if (payload.disputeId) await finish(payload.disputeId);
    else await finishPending();
  });

  return {
    open(user: CurrentUser, bookingId: string, input: OpenDisputeInput): DisputeView {
      const { booking, role } = bookingForParty(user, bookingId);
      if (!role) throw forbidden('Only the people on this booking can open a dispute');
      assertCan(user, 'open:dispute:own');
      if (!isDisputable(booking.status)) {
        throw conflict('booking_not_disputable', booking.status === 'disputed' ? 'A dispute is already open on this booking' : 'A dispute can be opened while the money is held: from funding until the delivery is accepted');
      }
      const id = randomUUID();
      const now = new Date();
      inTransaction(db, (tx) => {
        transitionBooking(tx, bookingId, [...DISPUTABLE_STATUSES], 'disputed');
        cancelAutoAccept(tx, bookingId);
        repo.insert({ id, bookingId, openedBy: user.id, reason: input.reason, text: input.text, status: 'open', bookingStatusBefore: booking.status, currency: booking.currency, createdAt: now }, tx);
        const title = `Dispute opened on “${booking.terms.songTitle}”`;
        const body = `${user.displayName} opened a dispute: ${DISPUTE_REASON_LABELS[input.reason].toLowerCase()}. The money stays held until an admin decides.`;
        for (const partyId of partiesOf(booking).filter((p) => p !== user.id)) {
          notifications.notify(partyId, { kind: 'dispute', title, body, link: `/bookings/${bookingId}`, mailParagraphs: [body, `What they wrote: ${input.text}`] }, tx);
        }
        for (const adminId of repo.adminIds().filter((a) => a !== user.id)) {
          notifications.notify(adminId, { kind: 'dispute', title, body, link: `/admin/disputes/${id}` }, tx);
        }
      });
      return toViews([repo.findById(id)!])[0];
    },

    forBooking(user: CurrentUser, bookingId: string): DisputeList {
      bookingForParty(user, bookingId);
      const items = toViews(repo.forBooking(bookingId));
      return { items, total: items.length };
    },

    list(user: CurrentUser, status: DisputeView['status'] | undefined): DisputeList {
      assertCan(user, 'settle:dispute:any', 'Only admins see the dispute queue');
      const items = toViews(repo.byStatus(status));
      return { items, total: items.length };
    },

    get(user: CurrentUser, disputeId: string): { dispute: DisputeView; booking: BookingRow } {
      const { dispute, booking } = disputeForAdmin(user, disputeId);
      return { dispute: toViews([dispute])[0], booking };
    },

    preview(user: CurrentUser, disputeId: string, input: PreviewSettlementInput): SettlementPreview {
      const { dispute, booking } = disputeForAdmin(user, disputeId);
      if (dispute.status !== 'open') throw conflict('dispute_settled', 'This dispute is already settled');
      return planFor(booking, input);
    },

    /**
     * Decides and settles. The plan is computed from what escrow holds now; with `expectedHeldMinor` (what
     * the confirmation step showed) a changed amount is refused rather than settled unseen.
     */
    async settle(user: CurrentUser, disputeId: string, input: SettleDisputeInput): Promise<{ dispute: DisputeView; plan: SettlementPreview }> {
      const { dispute, booking } = disputeForAdmin(user, disputeId);
      if (dispute.status === 'settled') throw conflict('dispute_settled', 'This dispute is already settled');
      if (dispute.decidedAt) throw conflict('settlement_in_progress', 'A decision on this dispute is being carried out');
      if (booking.status !== 'disputed') throw conflict('booking_state', `The booking is ${booking.status.replace('_', ' ')}, not disputed`);
      const plan = planFor(booking, input);
      if (input.expectedHeldMinor !== undefined && input.expectedHeldMinor !== plan.heldMinor) {
        throw conflict('held_changed', `Escrow now holds ${formatMoney(plan.heldMinor, plan.currency)}, not what the confirmation showed; check the amounts again`);
      }
      const decidedAt = new Date();
      db.transaction((tx) => {
        const claimed = repo.claimDecision(
          dispute.id,
          { outcome: input.outcome, heldMinor: plan.heldMinor, songwriterMinor: plan.songwriterMinor, feeRefundMinor: plan.serviceFeeRefundMinor, payeesMinor: plan.payeesMinor, decidedBy: user.id, decisionNote: input.note, decidedAt },
          tx,
        );
        if (!claimed) throw conflict('settlement_in_progress', 'Another admin decided this dispute a moment ago');
        jobs.enqueue(FINISH_SETTLEMENT_JOB, { disputeId: dispute.id }, { runAt: Date.now() + FINISH_AFTER_MS, dedupeKey: `finish-settlement:${dispute.id}` }, tx);
      });
      try {
        await finish(dispute.id, user);
      } catch (error) {
        // A refusal (4xx) came before any money moved: withdraw the decision so the admin can choose again.
        if (error instanceof AppError && error.status < 500) {
          repo.dropDecision(dispute.id, error.message);
          throw error;
        }
        // Anything else (the processor unreachable, say): the decision stands and the job finishes it.
        logger.info('dispute settlement left for the repair job', { disputeId, error: error instanceof Error ? error.message : String(error) });
        repo.noteError(dispute.id, error instanceof Error ? error.message : String(error));
      }
      return { dispute: toViews([repo.findById(dispute.id)!])[0], plan };
    },

    finishPending,

    toViews,
  };
}
export type DisputesService = ReturnType<typeof createDisputesService>;

function toPreviewInput(dispute: DisputeRow): PreviewSettlementInput {
  if (dispute.outcome === 'split') return { outcome: 'split', refundMinor: dispute.songwriterMinor ?? 0 };
  return { outcome: dispute.outcome ?? 'release' };
}
