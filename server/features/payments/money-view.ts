// What the booking page's money panel shows: where the money is, what the reader may do, receipts.
// Parties and admins only (outsiders get the booking's 404).
import type { Db } from '../../db/client';
import type { CurrentUser } from '../../auth/middleware';
import { can } from '@shared/permissions';
import { checkoutTotal, formatMoney, serviceFeeFor } from '@shared/money';
import { MONEY_NOTICE, type BookingMoneyView, type EscrowStage, type ReceiptView } from '@shared/schemas/payments';
import { escrowHeld } from '../ledger/ledger.service';
import { paymentsRepo as repo, type BookingRow, type IntentRow, type PaymentRow } from './payments.repository';
import { addOnsOutstanding, loadVisible, partyOf } from './escrow.service';
import { autoAcceptDate } from './auto-accept';

function stageOf(booking: BookingRow, outcome: string | null, unfinishedTransfers: number): EscrowStage {
  if (booking.status === 'awaiting_payment') return 'awaiting_payment';
  if (booking.status === 'paid_out') return 'paid_out';
  if (booking.status === 'settled') return 'settled';
  if (booking.status === 'cancelled') return outcome === 'refund' ? 'refunded' : 'cancelled';
  if (outcome === 'release' && unfinishedTransfers > 0) return 'awaiting_release';
  return 'funded';
}

function receiptsFor(user: CurrentUser, booking: BookingRow, payments: PaymentRow[], intents: IntentRow[]): ReceiptView[] {
  const admin = can(user.roles, 'read:booking:any');
  const isSongwriter = booking.songwriterId === user.id || admin;
  const receipts: ReceiptView[] = [];
  for (const p of payments.filter((x) => x.status === 'paid' && isSongwriter)) {
    receipts.push({
      id: p.id,
      title:
        p.kind === 'add_on'
          ? `Paid: ${p.units} extra revision${p.units === 1 ? '' : 's'} (${formatMoney(p.workMinor, p.currency)}) + service fee (${formatMoney(p.feeMinor, p.currency)})`
          : `Paid: agreed total (${formatMoney(p.workMinor, p.currency)}) + service fee (${formatMoney(p.feeMinor, p.currency)})`,
      amountMinor: p.amountMinor,
      currency: p.currency,
      at: (p.paidAt ?? p.createdAt).toISOString(),
      reference: p.chargeId,
    });
  }
  for (const i of intents.filter((x) => x.status === 'done')) {
    const mine = i.kind === 'refund' ? isSongwriter : i.payeeId === user.id || admin;
    if (!mine) continue;
    receipts.push({
      id: i.id,
      title: i.kind === 'refund' ? `Refunded to the songwriter: ${i.reason}` : `Transferred to the payee: ${i.reason}`,
      amountMinor: i.amountMinor,
      currency: i.currency,
      at: (i.doneAt ?? i.createdAt).toISOString(),
      reference: i.processorId,
    });
  }
  return receipts.sort((a, b) => a.at.localeCompare(b.at));
}

export function bookingMoneyView(db: Db, user: CurrentUser, bookingId: string): BookingMoneyView {
  const booking = loadVisible(db, user, bookingId);
  const money = repo.moneyOf(db, booking.id);
  const payments = repo.payments(db, booking.id);
  const intents = repo.intents(db, booking.id);
  const names = repo.names(db, intents.flatMap((i) => (i.payeeId ? [i.payeeId] : [])));
  const admin = can(user.roles, 'read:booking:any');
  const party = partyOf(booking, user.id);
  const songwriter = booking.songwriterId === user.id;
  const held = escrowHeld(db, booking.id, booking.currency);
  const outstanding = addOnsOutstanding(db, booking.id);
  const total = checkoutTotal(booking.totalMinor, booking.currency);
  const addOnWork = booking.terms.extraRevisionMinor * outstanding;
  const undecided = money.outcome === null;
  const heldStates = ['funded', 'recording', 'delivered', 'changes_requested', 'accepted', 'disputed'];
  // Payees see their own transfers; the songwriter sees refunds; admins see everything.
  const visibleIntents = intents.filter((i) => admin || songwriter || i.payeeId === user.id);
  return {
    bookingId: booking.id,
    bookingStatus: booking.status,
    stage: stageOf(booking, money.outcome, repo.unfinishedTransfers(db, booking.id)),
    currency: booking.currency,
    checkout: { agreedMinor: total.agreed, serviceFeeMinor: total.serviceFee, totalMinor: total.total },
    paidMinor: payments.filter((p) => p.status === 'paid').reduce((sum, p) => sum + p.amountMinor, 0),
    escrowHeldMinor: held,
    payments: (songwriter || admin ? payments : []).map((p) => ({
      id: p.id,
      kind: p.kind,
      status: p.status,
      workMinor: p.workMinor,
      feeMinor: p.feeMinor,
      amountMinor: p.amountMinor,
      currency: p.currency,
      lastError: p.lastError,
      createdAt: p.createdAt.toISOString(),
      paidAt: p.paidAt?.toISOString() ?? null,
    })),
    payouts: visibleIntents.map((i) => ({
      id: i.id,
      kind: i.kind,
      payee: i.payeeId ? { id: i.payeeId, displayName: names.get(i.payeeId) ?? 'Unknown' } : null,
      amountMinor: i.amountMinor,
      currency: i.currency,
      status: i.status,
      reason: i.reason,
      createdAt: i.createdAt.toISOString(),
      doneAt: i.doneAt?.toISOString() ?? null,
    })),
    receipts: receiptsFor(user, booking, payments, intents),
    autoAcceptAt: booking.status === 'delivered' ? (autoAcceptDate(db, booking.id)?.toISOString() ?? null) : null,
    addOn: { needed: outstanding, amountMinor: addOnWork, feeMinor: addOnWork > 0 ? serviceFeeFor(addOnWork, booking.currency) : 0 },
    cancelRequestedBy: money.cancelRequestedBy,
    can: {
      pay: songwriter && booking.status === 'awaiting_payment',
      payAddOn: songwriter && outstanding > 0 && ['delivered', 'changes_requested'].includes(booking.status),
      cancel: (!!party || admin) && (booking.status === 'awaiting_payment' || (undecided && ['funded', 'recording', 'delivered', 'changes_requested'].includes(booking.status))),
      release: undecided && held > 0 && ((songwriter && ['delivered', 'accepted'].includes(booking.status)) || (can(user.roles, 'release:booking:any') && heldStates.includes(booking.status))),
      refund: undecided && held > 0 && can(user.roles, 'refund:booking:any') && heldStates.includes(booking.status),
      split: undecided && can(user.roles, 'settle:dispute:any') && booking.status === 'disputed',
    },
    notice: MONEY_NOTICE,
  };
}
